import { ServerStatus } from '../../features/health/components/server-status';

const TASKS = [
  {
    title: 'Check',
    text: 'Find the gaps, time jumps, impossible speeds, multipath jumps and a drifting surface unit in every dive, with a verdict per dive.',
  },
  {
    title: 'Clean and re-solve',
    text: 'Smooth the track, or recompute it from slant range and bearing when the sound speed, compass offset or lever arm was set wrong.',
  },
  {
    title: 'Convert',
    text: "Deliver GPX, GeoJSON, CSV or KML in the client's coordinate reference system, with a summary of each dive.",
  },
  {
    title: 'Archive',
    text: 'Keep the season and its original logs where colleagues, clients and GIS pipelines can fetch them.',
  },
] as const;

/** The signed-out front page: what Leadline is and who it is for. */
export function LandingPage() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-abyss text-foam">
        <div className="mx-auto flex max-w-5xl items-center justify-between px-6 py-4">
          <span className="flex items-center gap-2 text-lg font-semibold tracking-wide">
            <img src="/leadline.svg" alt="" className="size-7" />
            Leadline
          </span>
        </div>
      </header>
      <main className="mx-auto w-full max-w-5xl flex-1 px-6 py-12">
        <h1 className="text-4xl font-semibold leading-tight">Leadline</h1>
        <p className="mt-4 max-w-3xl text-xl text-abyss-soft">
          After every dive, the USBL position logs of your ROVs and divers need checking, cleaning and putting into the
          client&rsquo;s coordinate system. Leadline does that job for one dive or a whole season, and keeps the results
          where your team and your client can reach them.
        </p>
        <ul className="mt-10 grid gap-4 sm:grid-cols-2">
          {TASKS.map((task) => (
            <li key={task.title} className="rounded-lg border border-abyss/10 bg-white p-5 shadow-sm">
              <h2 className="font-semibold text-kelp">{task.title}</h2>
              <p className="mt-1 text-abyss-soft">{task.text}</p>
            </li>
          ))}
        </ul>
        <aside className="mt-10 rounded-lg border-l-4 border-sand-deep bg-sand/20 p-5" aria-label="Safety">
          <h2 className="font-semibold">Not a navigation aid</h2>
          <p className="mt-1 text-abyss-soft">
            Positions from acoustic systems can be wrong by metres to tens of metres, more near structures and at long
            range. Leadline documents where a vehicle was; it does not steer one. Diving and ROV operations and survey
            deliverables follow local regulations, client specifications and licensed practice.
          </p>
        </aside>
      </main>
      <footer className="border-t border-abyss/10">
        <div className="mx-auto max-w-5xl px-6 py-4">
          <ServerStatus />
        </div>
      </footer>
    </div>
  );
}
