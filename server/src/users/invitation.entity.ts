import { EntitySchema } from 'typeorm';

/** An invitation link sent to a new user; only the hash of its token is kept. */
export interface InvitationRecord {
  id: string;
  userId: string;
  tokenHash: string;
  invitedBy: string;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
}

/** Table `invitations`. */
export const InvitationEntity = new EntitySchema<InvitationRecord>({
  name: 'Invitation',
  tableName: 'invitations',
  columns: {
    id: { type: 'varchar', primary: true },
    userId: { name: 'user_id', type: 'varchar' },
    tokenHash: { name: 'token_hash', type: 'varchar', unique: true },
    invitedBy: { name: 'invited_by', type: 'varchar' },
    createdAt: { name: 'created_at', type: 'varchar' },
    expiresAt: { name: 'expires_at', type: 'varchar' },
    acceptedAt: { name: 'accepted_at', type: 'varchar', nullable: true },
  },
});
