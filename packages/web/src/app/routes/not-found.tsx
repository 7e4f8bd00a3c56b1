import { Link } from 'react-router-dom';

/** Shown for any address the site does not know. */
export function NotFoundPage() {
  return (
    <div className="mx-auto max-w-xl px-6 py-24 text-center">
      <h1 className="text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-abyss-soft">This address does not lead to a page of Leadline.</p>
      <Link to="/" className="mt-6 inline-block rounded bg-abyss px-4 py-2 text-foam hover:bg-abyss-soft">
        Back to the start
      </Link>
    </div>
  );
}
