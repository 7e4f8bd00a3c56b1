import { useId } from 'react';
import { useCurrentOrganisation } from '../use-current-organisation';

/** The organisation being worked in, with the role there; a chooser for people in several. */
export function OrganisationSwitcher() {
  const id = useId();
  const { membership, memberships, switchTo } = useCurrentOrganisation();
  if (membership === null) return null;
  if (memberships.length < 2)
    return (
      <span className="text-foam/85">
        {membership.organisationName} · {membership.role}
      </span>
    );
  return (
    <span className="flex items-center gap-2">
      <label htmlFor={id} className="text-foam/85">
        Organisation
      </label>
      <select
        id={id}
        value={membership.organisationId}
        onChange={(event) => switchTo(event.target.value)}
        className="min-h-9 max-w-56 rounded-md border border-foam/40 bg-abyss-soft px-2 text-sm text-foam focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-sand"
      >
        {memberships.map((m) => (
          <option key={m.organisationId} value={m.organisationId}>
            {m.organisationName} ({m.role})
          </option>
        ))}
      </select>
    </span>
  );
}
