'use client';

import { useEffect, useState } from 'react';
import useSWR from 'swr';
import { inputClass } from '@/components/ui/field';
import { fetchJson } from '@/lib/fetcher';
import { handednessValues, sessionContextValues } from '@/lib/contracts/athletes';
import { athleteListResponseSchema, type AthleteSummary } from '@/lib/contracts/athletes';
import { contextLabels, handednessLabels } from '@/components/ui/format';
import { AthleteTable } from './athlete-table';

const fetchAthletes = fetchJson(athleteListResponseSchema);

type Filters = { q: string; context: string; handedness: string };

function toQueryString(filters: Filters): string {
  const params = new URLSearchParams();
  if (filters.q.trim()) params.set('q', filters.q.trim());
  if (filters.context) params.set('context', filters.context);
  if (filters.handedness) params.set('handedness', filters.handedness);
  return params.toString();
}

/** Waits `ms` after the last change before passing the value on (search as you type without a request per key). */
function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

export function RosterBrowser({ initial, initialFilters }: { initial: AthleteSummary[]; initialFilters: Filters }) {
  const [filters, setFilters] = useState<Filters>(initialFilters);
  const debouncedQuery = useDebounced(filters.q, 250);
  const query = toQueryString({ ...filters, q: debouncedQuery });
  const initialQuery = toQueryString(initialFilters);

  const { data, error, isLoading } = useSWR(`/api/athletes${query ? `?${query}` : ''}`, fetchAthletes, {
    fallbackData: query === initialQuery ? { athletes: initial, page: { offset: 0, limit: null, total: initial.length, nextOffset: null } } : undefined,
    keepPreviousData: true,
    revalidateOnMount: true,
  });

  // Keep the filters in the address bar so a filtered roster can be bookmarked or shared.
  useEffect(() => {
    const url = query ? `${window.location.pathname}?${query}` : window.location.pathname;
    window.history.replaceState(null, '', url);
  }, [query]);

  return (
    <div className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem_12rem]" role="search">
        <label className="block">
          <span className="sr-only">Search by name or home club</span>
          <input
            type="search"
            value={filters.q}
            onChange={(e) => setFilters((f) => ({ ...f, q: e.target.value }))}
            placeholder="Search name or home club"
            className={inputClass}
            data-testid="roster-search"
          />
        </label>
        <label className="block">
          <span className="sr-only">Session context</span>
          <select value={filters.context} onChange={(e) => setFilters((f) => ({ ...f, context: e.target.value }))} className={inputClass}>
            <option value="">Any session context</option>
            {sessionContextValues.map((c) => (
              <option key={c} value={c}>
                Has {contextLabels[c].toLowerCase()} sessions
              </option>
            ))}
          </select>
        </label>
        <label className="block">
          <span className="sr-only">Handedness</span>
          <select value={filters.handedness} onChange={(e) => setFilters((f) => ({ ...f, handedness: e.target.value }))} className={inputClass}>
            <option value="">Both hands</option>
            {handednessValues.map((h) => (
              <option key={h} value={h}>
                {handednessLabels[h]}
              </option>
            ))}
          </select>
        </label>
      </div>
      {error ? (
        <p role="alert" className="text-sm text-danger">
          Could not load the roster: {(error as Error).message}
        </p>
      ) : (
        <div aria-busy={isLoading}>
          <AthleteTable athletes={data?.athletes ?? []} />
          <p className="mt-3 text-sm text-ink-muted" aria-live="polite">
            {data ? `${data.athletes.length} athlete${data.athletes.length === 1 ? '' : 's'}` : 'Loading…'}
          </p>
        </div>
      )}
    </div>
  );
}
