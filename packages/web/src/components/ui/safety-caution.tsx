import { cn } from '../../lib/cn';

/** The product's safety caution (PRODUCT.md, Safety), shown on the landing and dive pages. */
export function SafetyCaution({ className }: { className?: string }) {
  return (
    <aside className={cn('rounded-lg border-l-4 border-sand-deep bg-sand/20 p-4', className)} aria-label="Safety">
      <h2 className="font-semibold">Not a navigation aid</h2>
      <p className="mt-1 text-sm text-abyss-soft">
        Positions from acoustic systems can be wrong by metres to tens of metres, more near structures and at long
        range. Leadline documents where a vehicle was; it does not steer one. Diving and ROV operations and survey
        deliverables follow local regulations, client specifications and licensed practice.
      </p>
    </aside>
  );
}
