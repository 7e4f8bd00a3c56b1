import { z } from 'zod';
import { InvalidArgumentError } from '../errors.js';
import type { AuditSetup } from './audit-setup.js';

const AuditSetupSchema = z.strictObject({
  surfaceStationary: z.boolean().optional(),
  transceiverDraftM: z.number().finite().nonnegative().optional(),
  maxRangeM: z.number().finite().positive().optional(),
  surfaceDriftWarnM: z.number().finite().positive().optional(),
  surfaceDriftFailM: z.number().finite().positive().optional(),
  uncertainty: z
    .strictObject({
      usblRangeFraction: z.number().nonnegative().max(1).optional(),
      usblFloorM: z.number().nonnegative().optional(),
      gnssHorizontal95M: z.number().nonnegative().optional(),
      heading95Deg: z.number().nonnegative().max(180).optional(),
      depthFloorM: z.number().nonnegative().optional(),
      depthFraction: z.number().nonnegative().max(1).optional(),
    })
    .optional(),
});

/**
 * Validates an audit setup (`surfaceStationary`, `transceiverDraftM`, `maxRangeM`,
 * `surfaceDriftWarnM`, `surfaceDriftFailM`, `uncertainty`)
 * read from JSON. Throws `InvalidArgumentError` listing every problem as `<key>: <what is wrong>`.
 */
export function parseAuditSetup(raw: unknown): AuditSetup {
  const parsed = AuditSetupSchema.safeParse(raw);
  if (parsed.success) {
    const { uncertainty, ...rest } = parsed.data;
    const setup: AuditSetup = {};
    if (rest.surfaceStationary !== undefined) setup.surfaceStationary = rest.surfaceStationary;
    if (rest.transceiverDraftM !== undefined) setup.transceiverDraftM = rest.transceiverDraftM;
    if (rest.maxRangeM !== undefined) setup.maxRangeM = rest.maxRangeM;
    if (rest.surfaceDriftWarnM !== undefined) setup.surfaceDriftWarnM = rest.surfaceDriftWarnM;
    if (rest.surfaceDriftFailM !== undefined) setup.surfaceDriftFailM = rest.surfaceDriftFailM;
    if (uncertainty !== undefined) {
      const clean = Object.fromEntries(Object.entries(uncertainty).filter(([, v]) => v !== undefined));
      setup.uncertainty = clean;
    }
    return setup;
  }
  throw new InvalidArgumentError(
    parsed.error.issues.map((issue) => `${issue.path.join('.') || '(top level)'}: ${issue.message}`).join('; '),
  );
}
