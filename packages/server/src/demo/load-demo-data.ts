import type { Knex } from 'knex';
import { hashPassword } from '../services/password.js';

/** The invented organisation and people of the demo; every name here is made up. */
export const DEMO_ORGANISATION = { name: 'Hollowtide Subsea', slug: 'hollowtide' } as const;
/** The demo sign-in that `npm start` prints. */
export const DEMO_PASSWORD = 'leadline-demo';
export const DEMO_USERS = [
  { email: 'maren@hollowtide.example', displayName: 'Maren Alvsaker', role: 'admin' },
  { email: 'tomas@hollowtide.example', displayName: 'Tomas Reyne', role: 'editor' },
  { email: 'ilse@hollowtide.example', displayName: 'Ilse Varga', role: 'viewer' },
] as const;

/** Loads the demo organisation and its users when the database holds no organisation yet; reports whether it did. */
export async function loadDemoData(db: Knex): Promise<{ loaded: boolean }> {
  const row = await db('organisations').count<{ count: string }[]>({ count: '*' }).first();
  if (Number(row?.count ?? 0) > 0) return { loaded: false };
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (trx) => {
    const [organisation] = await trx('organisations').insert(DEMO_ORGANISATION).returning<{ id: string }[]>('id');
    if (organisation === undefined) throw new Error('the demo organisation was not created');
    for (const user of DEMO_USERS) {
      const [created] = await trx('users')
        .insert({ email: user.email, display_name: user.displayName, password_hash: passwordHash })
        .returning<{ id: string }[]>('id');
      if (created === undefined) throw new Error(`the demo user ${user.email} was not created`);
      await trx('memberships').insert({ organisation_id: organisation.id, user_id: created.id, role: user.role });
    }
  });
  return { loaded: true };
}
