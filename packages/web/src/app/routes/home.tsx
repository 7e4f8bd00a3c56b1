import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/query-states';
import { useMe } from '../../features/auth/api/get-me';
import { useCurrentOrganisation } from '../../features/organisations/use-current-organisation';
import type { OrganisationDive } from '../../features/projects/api/list-organisation-dives';
import { useOrganisationDives } from '../../features/projects/api/list-organisation-dives';
import { useProjects } from '../../features/projects/api/list-projects';
import { DiveList } from '../../features/projects/components/dive-list';
import { LandingPage } from './landing';

const RECENT = new URLSearchParams({ sort: '-startTime', limit: '8' });
const ATTENTION = new URLSearchParams({ verdict: 'warn,fail', sort: '-startTime', limit: '8' });

function Section({
  title,
  id,
  action,
  children,
}: {
  title: string;
  id: string;
  action?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={id} className="text-xl font-semibold">
          {title}
        </h2>
        {action}
      </div>
      {children}
    </section>
  );
}

function DiveSection({
  query,
  projectNames,
  loading,
  failed,
  empty,
}: {
  query: UseQueryResult<{ dives: OrganisationDive[]; total: number }>;
  projectNames: Map<string, string>;
  loading: string;
  failed: string;
  empty: ReactNode;
}) {
  if (query.isPending) return <LoadingState label={loading} />;
  if (query.isError) return <ErrorState title={failed} error={query.error} onRetry={() => query.refetch()} />;
  if (query.data.dives.length === 0) return <>{empty}</>;
  return (
    <>
      <DiveList dives={query.data.dives} projectNames={projectNames} />
      {query.data.total > query.data.dives.length ? (
        <p className="text-sm text-abyss-soft">
          {query.data.dives.length} of {query.data.total} shown; the project pages list them all.
        </p>
      ) : null}
    </>
  );
}

/** The signed-in start page: dives needing attention, recent dives and the organisation's projects. */
export function HomePage() {
  const { membership } = useCurrentOrganisation();
  const organisationId = membership?.organisationId;
  const projects = useProjects(organisationId);
  const recent = useOrganisationDives(organisationId, RECENT);
  const attention = useOrganisationDives(organisationId, ATTENTION);
  const projectNames = new Map((projects.data ?? []).map((p) => [p.id, p.name]));

  if (!membership)
    return (
      <EmptyState title="You belong to no organisation yet">
        Ask an administrator of your organisation to invite you; the invitation e-mail brings you here.
      </EmptyState>
    );

  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-3xl font-semibold">{membership.organisationName}</h1>
          <p className="mt-1 text-abyss-soft">Your role here: {membership.role}</p>
        </div>
        {/* Switching organisation is the header's chooser, on every page. */}
      </div>

      <div className="grid gap-8 lg:grid-cols-2">
        <Section title="Needs attention" id="home-attention">
          <DiveSection
            query={attention}
            projectNames={projectNames}
            loading="Loading the dives that need attention…"
            failed="The dives needing attention could not be loaded"
            empty={
              <EmptyState title="Nothing needs attention">
                No dive has a warn or fail verdict in this organisation.
              </EmptyState>
            }
          />
        </Section>
        <Section title="Recent dives" id="home-recent">
          <DiveSection
            query={recent}
            projectNames={projectNames}
            loading="Loading the recent dives…"
            failed="The recent dives could not be loaded"
            empty={
              <EmptyState title="No dives yet">
                Dives appear here once logs are uploaded into a project and processed.
              </EmptyState>
            }
          />
        </Section>
      </div>

      <Section title="Projects" id="home-projects">
        {projects.isPending ? (
          <LoadingState label="Loading the projects…" />
        ) : projects.isError ? (
          <ErrorState
            title="The projects could not be loaded"
            error={projects.error}
            onRetry={() => projects.refetch()}
          />
        ) : projects.data.length === 0 ? (
          <EmptyState title="No projects yet">An administrator creates projects, one per job or site.</EmptyState>
        ) : (
          <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            {projects.data.map((project) => (
              <li key={project.id}>
                <Link
                  to={`/projects/${project.id}`}
                  className="flex h-full flex-col gap-1 rounded-lg border border-abyss/15 bg-white p-4 shadow-sm hover:border-kelp focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-kelp"
                >
                  <span className="font-semibold text-abyss-soft">{project.name}</span>
                  <span className="text-sm text-abyss-soft">
                    {[project.client, project.site].filter(Boolean).join(' · ') || 'No client or site given'}
                  </span>
                  <span className="text-sm">
                    {project.logCount} {project.logCount === 1 ? 'log' : 'logs'}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </Section>
    </div>
  );
}

/** `/`: the home page for signed-in people, the landing page for visitors. */
export function StartPage() {
  const me = useMe();
  if (me.isPending) return <LoadingState label="Checking sign-in…" />;
  return me.data ? <HomePage /> : <LandingPage />;
}
