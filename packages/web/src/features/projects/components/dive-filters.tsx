import { type FormEvent, useEffect, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { checkFilters, DEFAULT_LIST_STATE, type DiveListState } from '../lib/dive-list-query';
import type { Verdict } from '../types';

type FilterFields = Pick<DiveListState, 'fromDate' | 'toDate' | 'verdicts' | 'minDepthM' | 'maxDepthM' | 'text'>;

const VERDICT_CHOICES: Array<{ value: Verdict; label: string }> = [
  { value: 'pass', label: 'Pass' },
  { value: 'warn', label: 'Warn' },
  { value: 'fail', label: 'Fail' },
];

const FIELD = 'flex flex-col gap-1 text-sm';
const INPUT =
  'min-h-9 rounded-md border border-abyss/30 bg-white px-2 text-sm focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp aria-invalid:border-[#9c211a]';

function pickFilters(state: DiveListState): FilterFields {
  const { fromDate, toDate, verdicts, minDepthM, maxDepthM, text } = state;
  return { fromDate, toDate, verdicts, minDepthM, maxDepthM, text };
}

/**
 * The dive filters: a day range (UTC), verdicts, a maximum-depth range and words. Verdicts apply at
 * once; typed fields apply on "Apply" (or Enter), so the list is not asked on every key.
 */
export function DiveFilters({ state, onApply }: { state: DiveListState; onApply: (fields: FilterFields) => void }) {
  const [draft, setDraft] = useState<FilterFields>(() => pickFilters(state));
  // The address is the truth: going back in history or following a link resets the form to it.
  useEffect(() => setDraft(pickFilters(state)), [state]);
  const problems = checkFilters({ ...state, ...draft });
  const blocked = Object.keys(problems).length > 0;

  function submit(event: FormEvent) {
    event.preventDefault();
    if (!blocked) onApply(draft);
  }

  function toggleVerdict(verdict: Verdict, on: boolean) {
    const verdicts = on ? [...draft.verdicts, verdict] : draft.verdicts.filter((v) => v !== verdict);
    const next = { ...draft, verdicts: VERDICT_CHOICES.map((c) => c.value).filter((v) => verdicts.includes(v)) };
    setDraft(next);
    if (Object.keys(checkFilters({ ...state, ...next })).length === 0) onApply(next);
  }

  return (
    <form
      aria-label="Filter dives"
      onSubmit={submit}
      className="grid gap-3 rounded-lg border border-abyss/15 bg-white p-4 sm:grid-cols-2 lg:grid-cols-[auto_auto_auto_minmax(12rem,1fr)]"
    >
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-medium">Days (UTC)</legend>
        <div className="flex flex-wrap items-center gap-2">
          <label className="sr-only" htmlFor="filter-from">
            First day
          </label>
          <input
            id="filter-from"
            type="date"
            className={INPUT}
            value={draft.fromDate}
            aria-invalid={problems.dates ? true : undefined}
            aria-describedby={problems.dates ? 'filter-dates-problem' : undefined}
            onChange={(e) => setDraft({ ...draft, fromDate: e.target.value })}
          />
          <span aria-hidden="true">–</span>
          <label className="sr-only" htmlFor="filter-to">
            Last day
          </label>
          <input
            id="filter-to"
            type="date"
            className={INPUT}
            value={draft.toDate}
            aria-invalid={problems.dates ? true : undefined}
            aria-describedby={problems.dates ? 'filter-dates-problem' : undefined}
            onChange={(e) => setDraft({ ...draft, toDate: e.target.value })}
          />
        </div>
        {problems.dates ? (
          <p id="filter-dates-problem" className="text-sm text-[#7d1a14]">
            {problems.dates}
          </p>
        ) : null}
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-medium">Verdict</legend>
        <div className="flex flex-wrap gap-3 pt-1.5">
          {VERDICT_CHOICES.map((choice) => (
            <label key={choice.value} className="inline-flex items-center gap-1.5 text-sm">
              <input
                type="checkbox"
                className="size-4 accent-kelp"
                checked={draft.verdicts.includes(choice.value)}
                onChange={(e) => toggleVerdict(choice.value, e.target.checked)}
              />
              {choice.label}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-medium">Max depth (m)</legend>
        <div className="flex items-center gap-2">
          <label className="sr-only" htmlFor="filter-min-depth">
            Max depth at least (m)
          </label>
          <input
            id="filter-min-depth"
            type="number"
            inputMode="decimal"
            step="any"
            placeholder="from"
            className={`${INPUT} w-24`}
            value={draft.minDepthM}
            aria-invalid={problems.depths ? true : undefined}
            aria-describedby={problems.depths ? 'filter-depths-problem' : undefined}
            onChange={(e) => setDraft({ ...draft, minDepthM: e.target.value })}
          />
          <span aria-hidden="true">–</span>
          <label className="sr-only" htmlFor="filter-max-depth">
            Max depth at most (m)
          </label>
          <input
            id="filter-max-depth"
            type="number"
            inputMode="decimal"
            step="any"
            placeholder="to"
            className={`${INPUT} w-24`}
            value={draft.maxDepthM}
            aria-invalid={problems.depths ? true : undefined}
            aria-describedby={problems.depths ? 'filter-depths-problem' : undefined}
            onChange={(e) => setDraft({ ...draft, maxDepthM: e.target.value })}
          />
        </div>
        {problems.depths ? (
          <p id="filter-depths-problem" className="text-sm text-[#7d1a14]">
            {problems.depths}
          </p>
        ) : null}
      </fieldset>
      <div className={FIELD}>
        <label htmlFor="filter-text" className="font-medium">
          Words
        </label>
        <input
          id="filter-text"
          type="search"
          maxLength={200}
          placeholder="log file, dive, profile, check"
          className={INPUT}
          value={draft.text}
          onChange={(e) => setDraft({ ...draft, text: e.target.value })}
        />
      </div>
      <div className="flex flex-wrap gap-2 sm:col-span-2 lg:col-span-4">
        <button type="submit" className={buttonStyles('primary')} disabled={blocked}>
          Apply filters
        </button>
        <button
          type="button"
          className={buttonStyles('quiet')}
          onClick={() => {
            const cleared = pickFilters(DEFAULT_LIST_STATE);
            setDraft(cleared);
            onApply(cleared);
          }}
        >
          Clear filters
        </button>
      </div>
    </form>
  );
}
