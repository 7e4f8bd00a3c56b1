import { useQuery } from '@tanstack/react-query';
import { type KeyboardEvent, useEffect, useId, useMemo, useRef, useState } from 'react';
import { buttonStyles } from '../../../components/ui/button-styles';
import { cn } from '../../../lib/cn';
import { useCrsAt } from '../api/find-crs-at';
import { type CrsListing, searchCrsQueryOptions, useCrsSearch } from '../api/search-crs';
import { type CrsChoice, formatArea, normaliseCrsValue, QUICK_CHOICES } from '../lib/crs-choices';

/** What the picker needs. `value` is `EPSG:<code>` or `utm`. */
export interface CrsPickerProps {
  value: string;
  onChange: (value: string) => void;
  label: string;
  /** A position (WGS 84 degrees) whose covering CRSs are offered before anything is typed. */
  near?: { latDeg: number; lonDeg: number } | undefined;
  /** A line under the label (what the CRS applies to). */
  description?: string;
  disabled?: boolean;
  className?: string;
}

interface OptionGroup {
  title: string;
  choices: CrsChoice[];
}

function choiceOf(listing: CrsListing): CrsChoice {
  const where = listing.areaOfUse?.description || (listing.areaOfUse ? formatArea(listing.areaOfUse) : '');
  return {
    value: listing.code,
    name: listing.name,
    detail: [listing.code, listing.kind, where].filter((part) => part !== '').join(' · '),
  };
}

const DEBOUNCE_MS = 250;

function useDebounced(text: string): string {
  const [debounced, setDebounced] = useState(text);
  useEffect(() => {
    const timer = window.setTimeout(() => setDebounced(text), DEBOUNCE_MS);
    return () => window.clearTimeout(timer);
  }, [text]);
  return debounced;
}

/** The name shown for the current value: a quick choice, a listing seen already, or one looked up by code. */
function useValueName(value: string, seen: Map<string, string>): string {
  const quick = QUICK_CHOICES.find((c) => c.value === value);
  const code = quick === undefined && !seen.has(value) ? normaliseCrsValue(value) : undefined;
  const lookup = useQuery({
    ...searchCrsQueryOptions(code ?? ''),
    enabled: code !== undefined && code !== 'utm',
  });
  if (quick) return `${quick.name} (${quick.value === 'utm' ? 'utm' : quick.value})`;
  const known = seen.get(value) ?? lookup.data?.find((l) => l.code === value)?.name;
  return known === undefined ? value : `${known} (${value})`;
}

/**
 * A combobox for a coordinate reference system: quick choices (WGS 84, UTM from the data), the CRSs
 * covering `near`, and a search of the EPSG registry by code or name words through `GET /api/v1/crs`.
 * Keyboard: arrows move, Enter picks, Escape closes; typing a bare code (`25832`) and Enter picks it.
 */
export function CrsPicker({ value, onChange, label, near, description, disabled, className }: CrsPickerProps) {
  const id = useId();
  const inputId = `${id}-input`;
  const listId = `${id}-list`;
  const descriptionId = `${id}-description`;
  const [open, setOpen] = useState(false);
  const [text, setText] = useState('');
  const [active, setActive] = useState(0);
  const [seen] = useState(() => new Map<string, string>());
  const inputRef = useRef<HTMLInputElement>(null);
  const debounced = useDebounced(text);
  const searching = text.trim() !== '';
  const search = useCrsSearch(searching ? debounced : '');
  const covering = useCrsAt(open ? near : undefined);
  const valueName = useValueName(value, seen);

  const groups = useMemo<OptionGroup[]>(() => {
    if (searching) return [{ title: 'Matches', choices: (search.data ?? []).map(choiceOf) }];
    const list: OptionGroup[] = [{ title: 'Quick choices', choices: [...QUICK_CHOICES] }];
    const around = (covering.data ?? []).map(choiceOf).filter((c) => !QUICK_CHOICES.some((q) => q.value === c.value));
    if (around.length > 0) list.push({ title: 'Covering this position', choices: around });
    return list;
  }, [searching, search.data, covering.data]);
  const flat = groups.flatMap((g) => g.choices);

  useEffect(() => {
    for (const choice of flat) if (choice.value.startsWith('EPSG:')) seen.set(choice.value, choice.name);
  }, [flat, seen]);

  function pick(choice: CrsChoice) {
    seen.set(choice.value, choice.name);
    onChange(choice.value);
    setOpen(false);
    setText('');
  }

  function onKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      if (!open) {
        setOpen(true);
        setActive(0);
        return;
      }
      const step = event.key === 'ArrowDown' ? 1 : -1;
      setActive((i) => (flat.length === 0 ? 0 : (i + step + flat.length) % flat.length));
    } else if (event.key === 'Enter') {
      if (!open) return;
      event.preventDefault();
      const choice = flat[active];
      if (choice) pick(choice);
      else {
        // A code typed in full picks itself even before the search answers.
        const typed = normaliseCrsValue(text);
        if (typed !== undefined) {
          onChange(typed);
          setOpen(false);
          setText('');
        }
      }
    } else if (event.key === 'Escape') {
      if (open) {
        event.preventDefault();
        setOpen(false);
        setText('');
      }
    }
  }

  const activeChoice = open ? flat[active] : undefined;
  const optionId = (index: number) => `${id}-option-${index}`;
  const status = searching
    ? search.isError
      ? 'error'
      : text.trim() !== debounced.trim() || search.isFetching
        ? 'loading'
        : flat.length === 0
          ? 'empty'
          : 'ready'
    : 'ready';

  let index = -1;
  return (
    <div className={cn('relative flex flex-col gap-1', className)}>
      <label htmlFor={inputId} className="text-sm font-medium">
        {label}
      </label>
      {description ? (
        <p id={descriptionId} className="text-xs text-abyss-soft">
          {description}
        </p>
      ) : null}
      <input
        ref={inputRef}
        id={inputId}
        type="text"
        role="combobox"
        aria-expanded={open}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={activeChoice ? optionId(flat.indexOf(activeChoice)) : undefined}
        aria-describedby={description ? descriptionId : undefined}
        autoComplete="off"
        spellCheck={false}
        disabled={disabled}
        placeholder={open ? 'Code or name, e.g. 25832 or ETRS89 UTM 32N' : undefined}
        value={open ? text : valueName}
        onFocus={() => {
          setOpen(true);
          setActive(0);
        }}
        onClick={() => setOpen(true)}
        onBlur={() => {
          setOpen(false);
          setText('');
        }}
        onChange={(event) => {
          setText(event.target.value);
          setOpen(true);
          setActive(0);
        }}
        onKeyDown={onKeyDown}
        className="min-h-9 w-full rounded-md border border-abyss/30 bg-white px-3 text-sm focus-visible:outline-3 focus-visible:outline-offset-1 focus-visible:outline-kelp disabled:opacity-60"
      />
      <div
        id={listId}
        role="listbox"
        aria-label={`${label}: choices`}
        hidden={!open}
        // Keeps focus in the input while a choice is clicked.
        onMouseDown={(event) => event.preventDefault()}
        className="absolute top-full z-20 mt-1 max-h-80 w-full min-w-72 overflow-auto rounded-md border border-abyss/20 bg-white py-1 shadow-lg"
      >
        {groups.map((group) => (
          // biome-ignore lint/a11y/useSemanticElements: a group inside an ARIA listbox, as the combobox pattern has it
          <div key={group.title} role="group" aria-label={group.title}>
            <div
              aria-hidden="true"
              className="px-3 pt-2 pb-1 text-xs font-semibold tracking-wide text-abyss-soft uppercase"
            >
              {group.title}
            </div>
            {group.choices.map((choice) => {
              index++;
              const i = index;
              const selected = choice.value === value;
              return (
                // biome-ignore lint/a11y/useKeyWithClickEvents: the combobox input handles the keys (aria-activedescendant)
                <div
                  key={choice.value}
                  id={optionId(i)}
                  role="option"
                  aria-selected={selected}
                  tabIndex={-1}
                  onClick={() => pick(choice)}
                  onMouseMove={() => setActive(i)}
                  className={cn(
                    'cursor-pointer px-3 py-1.5 text-sm',
                    i === active ? 'bg-foam' : '',
                    selected ? 'font-semibold' : '',
                  )}
                >
                  <div>{choice.name}</div>
                  <div className="text-xs text-abyss-soft">{choice.detail}</div>
                </div>
              );
            })}
          </div>
        ))}
        {status === 'loading' ? (
          <div role="status" className="px-3 py-2 text-sm text-abyss-soft">
            Searching the EPSG registry…
          </div>
        ) : null}
        {status === 'empty' ? (
          <div role="status" className="px-3 py-2 text-sm text-abyss-soft">
            No CRS matches “{text.trim()}”. Try a code such as 25832 or words of the name.
          </div>
        ) : null}
        {status === 'error' ? (
          <div role="alert" className="flex items-center justify-between gap-2 px-3 py-2 text-sm text-[#7d1a14]">
            <span>The CRS search failed: {search.error instanceof Error ? search.error.message : 'no answer'}</span>
            <button type="button" className={buttonStyles('secondary')} onClick={() => search.refetch()}>
              Try again
            </button>
          </div>
        ) : null}
        {!searching && near !== undefined && covering.isPending ? (
          <div role="status" className="px-3 py-2 text-sm text-abyss-soft">
            Finding CRSs covering this position…
          </div>
        ) : null}
        {!searching && covering.isError ? (
          <div role="alert" className="flex items-center justify-between gap-2 px-3 py-2 text-sm text-[#7d1a14]">
            <span>Could not list the CRSs covering this position.</span>
            <button type="button" className={buttonStyles('secondary')} onClick={() => covering.refetch()}>
              Try again
            </button>
          </div>
        ) : null}
      </div>
    </div>
  );
}
