import type { ReactNode } from 'react';
import { Caution } from '@/components/ui/caution';
import { SectionCard } from '@/components/ui/section-card';

/** Said in every calculator's caution. */
const GENERAL_CAUTION =
  "Stay within the manufacturer's data, the tyre and wheel makers' limits, the event's rules and local law. These numbers are planning aids, not a substitute for inspection.";

/**
 * One calculator: its inputs and live results, the formula and its source in one line, and a short caution that
 * names the safety points for this job.
 */
export function CalculatorCard({
  title,
  formula,
  source,
  caution,
  children,
}: {
  title: string;
  /** The formula as written in Scrubline's reference, e.g. "k_w = k·MR²·cos²θ". */
  formula: string;
  /** Where it comes from, e.g. "Barton & Fieldhouse, Automotive Chassis Engineering §3.9". */
  source: string;
  /** The points specific to this job; the general one follows. */
  caution: string;
  children: ReactNode;
}) {
  return (
    <SectionCard title={title}>
      <p className="text-sm">
        <span className="font-semibold">Formula: </span>
        <code className="rounded bg-surface-raised px-1 font-mono text-[0.8125rem]">{formula}</code>
        <span className="text-ink-muted"> — {source}</span>
      </p>
      {children}
      <Caution>
        <p>{caution}</p>
        <p>{GENERAL_CAUTION}</p>
      </Caution>
    </SectionCard>
  );
}

/** A smaller heading inside a calculator card. */
export function CalcHeading({ children }: { children: ReactNode }) {
  return <h3 className="text-lg font-bold">{children}</h3>;
}

/**
 * Live results, read out politely as they change: a labelled group of result rows, notes and grids (a row is a
 * name and its value, so only the rows are description lists).
 */
export function Results({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div aria-live="polite" className="rounded border border-line bg-surface-raised p-3">
      <div role="group" aria-label={label} className="tabular-figures flex flex-col gap-1">
        {children}
      </div>
    </div>
  );
}

/** One result: its name and its value in the user's units. */
export function ResultRow({ term, children, emphasis = false }: { term: ReactNode; children: ReactNode; emphasis?: boolean }) {
  return (
    <dl className="flex flex-wrap items-baseline justify-between gap-x-3">
      <dt className="font-semibold">{term}</dt>
      <dd className={emphasis ? 'text-2xl font-bold' : 'text-lg font-bold'}>{children}</dd>
    </dl>
  );
}

/** What to do before a result can show, or why it cannot. */
export function ResultNote({ children, error = false }: { children: ReactNode; error?: boolean }) {
  return error ? (
    <p role="alert" className="text-sm font-semibold text-warning">
      {children}
    </p>
  ) : (
    <p className="text-sm text-ink-muted">{children}</p>
  );
}

/**
 * Inputs the calculation still answers but the job never sees (a typo, a unit mix-up, a slipped decimal point):
 * the result stays in view and this says, with the limits, to check the numbers before acting on it.
 */
export function CheckTheNumbers({ outside, limits, before }: { outside: string; limits: string; before: string }) {
  return (
    <ResultNote error>
      These numbers are outside what {outside} ({limits}). Check them before {before}.
    </ResultNote>
  );
}
