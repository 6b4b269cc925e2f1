import type { PlannedComment } from '../bcf-import-plan';

/**
 * A comment from a BCF file as stored: written by the user who imported it, at the time of the import. The file's
 * author and date are anyone's to type, so they are kept only as quoted text above the comment, never as authorship.
 */
export function importedCommentRow(comment: PlannedComment, importer: { id: string; email: string }, importedAt: Date) {
  return {
    findingId: comment.findingId,
    guid: comment.guid,
    authorId: importer.id,
    authorEmail: importer.email,
    text: `from BCF: “${comment.authorEmail}”, ${comment.createdAt.toISOString()}\n\n${comment.text}`,
    createdAt: importedAt,
  };
}
