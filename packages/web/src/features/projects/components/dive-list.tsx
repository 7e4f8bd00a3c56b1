import { Link } from 'react-router-dom';
import type { OrganisationDive } from '../api/list-organisation-dives';
import { diveLabel, formatMetres, formatUtc } from '../lib/format';
import { VerdictBadge } from './verdict-badge';

/** A short list of dives from any project: name (a link), project, start, max depth and verdict. */
export function DiveList({ dives, projectNames }: { dives: OrganisationDive[]; projectNames: Map<string, string> }) {
  return (
    <ul className="divide-y divide-abyss/10 rounded-lg border border-abyss/15 bg-white">
      {dives.map((dive) => (
        <li key={dive.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 px-4 py-2.5">
          <div className="min-w-0">
            <Link
              to={`/dives/${dive.id}`}
              className="font-medium text-abyss-soft underline underline-offset-2 hover:text-abyss focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
            >
              {diveLabel(dive)}
            </Link>
            <p className="text-sm text-abyss-soft">
              {projectNames.get(dive.projectId) ?? 'Project'} · {formatUtc(dive.startTime)} UTC ·{' '}
              {formatMetres(dive.maxDepthM)}
            </p>
          </div>
          <VerdictBadge verdict={dive.verdict} />
        </li>
      ))}
    </ul>
  );
}
