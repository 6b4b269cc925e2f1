import { Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { ModelRevision } from './model-revision.entity';

/** The whole MemberRecord (server/ifc/model-read-result.ts) of a model_member row, as JSON; written by member-store.ts. */
@Entity({ name: 'model_member_record' })
export class ModelMemberRecord {
  @PrimaryColumn({ type: String })
  revisionId: string;

  @PrimaryColumn({ type: 'integer' })
  expressId: number;

  @Column({ type: 'text' })
  record: string;

  @ManyToOne(() => ModelRevision, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revisionId' })
  revision?: ModelRevision;
}
