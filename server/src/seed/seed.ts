import { randomUUID } from 'node:crypto';
import { recordAudit } from '../audit/audit.service.js';
import type { Role } from '../auth/permissions.js';
import { hashPassword } from '../auth/password.js';
import { type AppContext, logLine, now } from '../context.js';
import { countUsers, findUserByEmail, insertUser } from '../users/users.repository.js';
import { DEMO_PEOPLE } from './demo-people.js';
import { seedDemoModels } from '../models/models.seed.js';

async function createUser(context: AppContext, email: string, name: string, role: Role, password: string): Promise<string> {
  const iso = now(context).toISOString();
  const id = randomUUID();
  await insertUser(context, { id, email: email.toLowerCase(), name, role, status: 'active', passwordHash: await hashPassword(password), createdAt: iso, updatedAt: iso });
  await recordAudit(context, { action: 'user.seeded', actorId: null, targetType: 'user', targetId: id, detail: { email, role } });
  return id;
}

/**
 * First run: with no users at all, creates the admin from POLEWRIGHT_ADMIN_EMAIL/PASSWORD (when both are
 * set) and, unless POLEWRIGHT_DEMO=off, one demo user per role and the demo models; prints the credentials.
 * Does nothing on a database that has users.
 */
export async function seed(context: AppContext): Promise<void> {
  if ((await countUsers(context)) > 0) return;
  const { adminEmail, adminPassword, demo } = context.config;
  if (adminEmail && adminPassword) {
    await createUser(context, adminEmail, 'Administrator', 'admin', adminPassword);
    logLine(context, `first run: admin ${adminEmail} created from POLEWRIGHT_ADMIN_EMAIL`);
  }
  if (!demo) return;
  const ids = new Map<Role, string>();
  for (const person of DEMO_PEOPLE) {
    if (await findUserByEmail(context, person.email)) continue;
    ids.set(person.role, await createUser(context, person.email, person.name, person.role, person.password));
  }
  const authorId = ids.get('engineer') ?? ids.get('admin');
  if (authorId) await seedDemoModels(context, authorId);
  logLine(context, 'demo users (Quillfield Conveyor Works; POLEWRIGHT_DEMO=off to skip):');
  for (const person of DEMO_PEOPLE) logLine(context, `  ${person.role.padEnd(8)} ${person.email.padEnd(34)} ${person.password}`);
}
