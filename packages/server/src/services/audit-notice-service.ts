import type { Mailer } from '../mail/mailer.js';
import type { ProjectStore } from '../stores/project-store.js';

/** A finding as the notice lists it. */
export interface NoticeFinding {
  check: string;
  severity: string;
  message: string;
}

/** What a failed audit is about. */
export interface FailedAudit {
  organisationId: string;
  projectId: string;
  /** The uploaded file the dive came from. */
  logFileName: string;
  /** How people name the dive, e.g. `dive 3, 2026-06-01 10:00 UTC`. */
  diveLabel: string;
  /** Where the dive can be looked at, relative to the site, e.g. `/projects/<id>/dives/<id>`. */
  divePath: string;
  findings: readonly NoticeFinding[];
}

const LISTED_FINDINGS = 10;

/**
 * Mails every watcher of the project that a dive failed its audit, listing the first findings; one
 * message per watcher. Returns how many were sent (0 without watchers or without the project).
 */
export async function notifyFailedAudit(
  deps: { projects: ProjectStore; mailer: Mailer; publicUrl: string },
  audit: FailedAudit,
): Promise<number> {
  const project = await deps.projects.find(audit.organisationId, audit.projectId);
  if (project === undefined) return 0;
  const watchers = await deps.projects.watchers(audit.projectId);
  const listed = audit.findings.slice(0, LISTED_FINDINGS).map((f) => `  - [${f.severity}] ${f.check}: ${f.message}`);
  const more = audit.findings.length - listed.length;
  const text = [
    `A dive in ${project.name} failed its audit.`,
    '',
    `Dive: ${audit.diveLabel}`,
    `Log: ${audit.logFileName}`,
    `Findings (${audit.findings.length}):`,
    ...listed,
    ...(more > 0 ? [`  … and ${more} more`] : []),
    '',
    `Look at it here: ${deps.publicUrl.replace(/\/+$/, '')}${audit.divePath}`,
    '',
    'You get this because you watch the project; stop watching on its page.',
  ].join('\n');
  for (const watcher of watchers)
    await deps.mailer.send({ to: watcher.email, subject: `Failed audit: ${audit.diveLabel} in ${project.name}`, text });
  return watchers.length;
}
