import { describeFailure } from './describe-failure';

/** The live line under a form that says why sending it failed (empty, and hidden, otherwise). */
export function FormFailure({ error, id }: { error: unknown; id?: string }) {
  return (
    <div id={id} role="alert" className="text-sm text-[#9c211a] empty:hidden">
      {error ? describeFailure(error) : ''}
    </div>
  );
}
