/*
 * Every entity of the server, in one list (each feature owner adds its own line).
 */
import type { EntitySchema } from 'typeorm';
import { ApiKeyEntity } from '../api-keys/api-key.entity.js';
import { AuditEventEntity } from '../audit/audit-event.entity.js';
import { EmbedTokenEntity } from '../embed-tokens/embed-token.entity.js';
import { ModelRevisionEntity } from '../models/model-revision.entity.js';
import { ModelEntity } from '../models/model.entity.js';
import { SessionEntity } from '../sessions/session.entity.js';
import { InvitationEntity } from '../users/invitation.entity.js';
import { UserEntity } from '../users/user.entity.js';

/** All entities (EntitySchema, so no decorator metadata is needed). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const ENTITIES: EntitySchema<any>[] = [
  UserEntity,
  InvitationEntity,
  SessionEntity,
  ApiKeyEntity,
  EmbedTokenEntity,
  AuditEventEntity,
  ModelEntity,
  ModelRevisionEntity,
];
