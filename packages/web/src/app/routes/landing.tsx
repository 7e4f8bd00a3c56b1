import { Link } from 'react-router-dom';
import { buttonStyles } from '../../components/ui/button-styles';
import { SafetyCaution } from '../../components/ui/safety-caution';
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
    <div className="mx-auto flex w-full max-w-5xl flex-col gap-10 py-6">
      <div>
        <h1 className="text-4xl font-semibold leading-tight">Leadline</h1>
        <p className="mt-4 max-w-3xl text-xl text-abyss-soft">
          After every dive, the USBL position logs of your ROVs and divers need checking, cleaning and putting into the
          client&rsquo;s coordinate system. Leadline does that job for one dive or a whole season, and keeps the results
          where your team and your client can reach them.
        </p>
      </div>
      <ul className="grid gap-4 sm:grid-cols-2">
        {TASKS.map((task) => (
          <li key={task.title} className="rounded-lg border border-abyss/10 bg-white p-5 shadow-sm">
            <h2 className="font-semibold text-kelp">{task.title}</h2>
            <p className="mt-1 text-abyss-soft">{task.text}</p>
          </li>
        ))}
      </ul>
      <p>
        <Link to="/preview/dive" className={buttonStyles('primary', 'min-h-10')}>
          Look at a simulated dive
        </Link>
      </p>
      <SafetyCaution />
      <footer className="border-t border-abyss/10 pt-4">
        <ServerStatus />
      </footer>
    </div>
  );
}
