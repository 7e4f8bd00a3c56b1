import type { UncertaintyModel } from './audit-profile.js';

/**
 * What the audit needs to know about how the positioning was set up, beyond the platform's
 * profile. Every field is optional; a check that needs a missing one says so in an `info` finding
 * or stays silent.
 */
export interface AuditSetup {
  /** The surface unit was meant to stay put (moored, on a quay, jack-up, dynamic positioning). */
  surfaceStationary?: boolean;
  /** Transceiver depth below the water surface, metres. */
  transceiverDraftM?: number;
  /**
   * Override the profile's surface-drift limits, metres: a boat holding position wanders more than a
   * pole on a quay (common practice: a small boat holds station within a circle of about 10 m).
   */
  surfaceDriftWarnM?: number;
  surfaceDriftFailM?: number;
  /** Overrides the profile's acoustic or tether range, metres. */
  maxRangeM?: number;
  /** Overrides the profile's uncertainty model key by key (the system's stated accuracies). */
  uncertainty?: Partial<UncertaintyModel>;
}
