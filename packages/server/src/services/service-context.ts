import type { Mailer } from '../mail/mailer.js';
import type { ActivityStore } from '../stores/activity-store.js';
import type { ApiTokenStore } from '../stores/api-token-store.js';
import type { EmailLinkStore } from '../stores/email-link-store.js';
import type { HealthStore } from '../stores/health-store.js';
import type { UserStore } from '../stores/user-store.js';

/** Everything the services reach: the stores, the mailer, the public address of the site and the clock. */
export interface ServiceContext {
  users: UserStore;
  tokens: ApiTokenStore;
  activity: ActivityStore;
  links: EmailLinkStore;
  health: HealthStore;
  mailer: Mailer;
  /** Base of the links sent by e-mail, e.g. `http://127.0.0.1:8480`; no trailing slash. */
  publicUrl: string;
  now: () => Date;
}
