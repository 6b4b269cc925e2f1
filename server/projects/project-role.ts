/** Roles a user can hold in one project (site admin is a user flag, not a project role). */
export const PROJECT_ROLES = ['coordinator', 'engineer', 'reviewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];
