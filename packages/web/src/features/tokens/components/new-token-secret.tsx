import { useEffect, useRef } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { CopyButton } from '../../../components/ui/copy-button';
import type { CreatedToken } from '../api/create-token';

/** The curl call that lists the organisation's projects with a token, against this server. */
export function curlExample(origin: string, organisationId: string, token: string): string {
  return `curl -H "Authorization: Bearer ${token}" ${origin}/api/v1/organisations/${organisationId}/projects`;
}

/** The secret of a token just created, shown this once, with a copy button and a curl example. */
export function NewTokenSecret({
  created,
  organisationId,
  origin,
  onDone,
}: {
  created: CreatedToken;
  organisationId: string;
  origin: string;
  onDone: () => void;
}) {
  const heading = useRef<HTMLHeadingElement>(null);
  // Move focus here so keyboard and screen-reader users land on the secret they must copy now.
  useEffect(() => heading.current?.focus(), []);
  const curl = curlExample(origin, organisationId, created.token);
  return (
    <section
      aria-labelledby="new-token-title"
      className="flex flex-col gap-3 rounded-lg border-2 border-sand-deep bg-white p-5"
    >
      <h2 id="new-token-title" ref={heading} tabIndex={-1} className="text-lg font-semibold focus:outline-none">
        Token “{created.apiToken.name}” created
      </h2>
      <p className="font-medium">
        Copy the token now: it is shown only this once. Leadline keeps only a hash of it and cannot show it again.
      </p>
      <div className="flex flex-col gap-1">
        <label htmlFor="new-token" className="text-sm font-medium">
          Token
        </label>
        <input
          id="new-token"
          readOnly
          value={created.token}
          onFocus={(event) => event.currentTarget.select()}
          className="min-h-10 w-full rounded-md border border-abyss/30 bg-foam px-3 font-mono text-sm focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp"
        />
        <div>
          <CopyButton text={created.token} label="Copy the token" />
        </div>
      </div>
      <div className="flex flex-col gap-1">
        <h3 className="text-sm font-medium">Try it: list the projects</h3>
        <pre className="overflow-x-auto rounded-md bg-abyss px-3 py-2 font-mono text-sm whitespace-pre-wrap break-all text-foam">
          {curl}
        </pre>
        <div>
          <CopyButton text={curl} label="Copy the curl command" />
        </div>
      </div>
      <div>
        <button type="button" className={buttonStyles('primary')} onClick={onDone}>
          I have copied it
        </button>
      </div>
    </section>
  );
}
