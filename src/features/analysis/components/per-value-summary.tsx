import { useId } from 'react';
import type { ScatterResult } from '@shared/analysis/analysis.schema';
import type { RunOrderCheck } from '@shared/calc/comparison.calc';
import { formatFixed } from '@shared/calc/display';
import { Caution } from '@/components/ui/caution';
import { useUnits } from '@/lib/units-context';
import { BETWEEN_EVENTS_ADVICE, LOCATION_WORDS, PARAM_INFO, settingText } from '../utils/analysis-format';

/** The caution when a setting's values follow the order of a day's runs; null when no day had them in blocks. */
export function runOrderCaution({ daysChanged, daysInBlocks }: RunOrderCheck): string | null {
  if (daysInBlocks === 0) return null;
  const days =
    daysChanged === 1
      ? 'On the one day this setting was changed between runs'
      : daysInBlocks === daysChanged
        ? `On each of the ${daysChanged} days this setting was changed between runs`
        : `On ${daysInBlocks} of the ${daysChanged} days this setting was changed between runs`;
  return (
    `${days}, every run on the later value came after every run on the earlier one. Drivers usually get quicker ` +
    'through a day, so the later value can look quicker than it is: part of the gap may be run order, not the ' +
    'setting. Going back and forth between the values through a day tells the two apart.'
  );
}

/**
 * Under the time plot: each value of the setting with its runs, the events they came from, and the average ± spread
 * of % off the day's best, as the server worked them out; and a caution when the values follow the day's run order,
 * or when no day had more than one of them (the measure resets each day, so it cannot compare them).
 */
export function PerValueSummary({ result }: { result: ScatterResult }) {
  const units = useUnits();
  const headingId = useId();
  const perValue = result.perValue;
  if (!perValue || perValue.values.length === 0) return null;
  const { label, inSentence } = PARAM_INFO[result.x.param];
  // "Time for each value of rear damper clicks": the axle or corner too, as the plot above reads one.
  const heading = `Time for each value of ${LOCATION_WORDS[result.x.corner] ?? result.x.corner} ${inSentence}`;
  const caution = runOrderCaution(perValue.runOrder);
  const cell = 'py-1 pr-3';
  return (
    <div className="flex flex-col gap-2">
      <h3 id={headingId} className="font-bold">
        {heading}
      </h3>
      <p className="text-sm text-ink-muted">
        The runs on each value, the events they came from, and their % off the day&apos;s best: the average ± the usual
        spread (one standard deviation). Lower is quicker.
      </p>
      {/* Short columns that wrap between words, so the table fits a 320 px screen without scrolling sideways. */}
      <table aria-labelledby={headingId} className="tabular-figures w-full text-left text-sm">
        <thead>
          <tr className="border-b border-line-strong align-bottom">
            <th scope="col" className={cell}>{label}</th>
            <th scope="col" className={cell}>Runs</th>
            <th scope="col" className={cell}>Events</th>
            <th scope="col" className="py-1">Off the day&apos;s best</th>
          </tr>
        </thead>
        <tbody>
          {perValue.values.map((v) => (
            <tr key={v.value} className="border-b border-line align-top">
              <th scope="row" className={`${cell} whitespace-nowrap font-normal`}>{settingText(result.x, v.value, units)}</th>
              <td className={cell}>{v.n}</td>
              <td className={cell}>{v.days}</td>
              <td className="py-1">
                <span className="whitespace-nowrap">{formatFixed(v.mean, 2)}</span>{' '}
                {v.sd === null ? (
                  <span>% (one run: no spread)</span>
                ) : (
                  <span className="whitespace-nowrap">± {formatFixed(v.sd, 2)} %</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {caution ? (
        <Caution title="The values follow run order">
          <p>{caution}</p>
        </Caution>
      ) : null}
      {perValue.values.length > 1 && perValue.runOrder.daysChanged === 0 ? (
        <Caution title="Each value ran on other days">
          <p>
            No day had runs on more than one of these values, and each run is measured against the same driver&apos;s best
            that day, so a change made between events cannot show in these averages. Judge it {BETWEEN_EVENTS_ADVICE}
          </p>
        </Caution>
      ) : null}
    </div>
  );
}
