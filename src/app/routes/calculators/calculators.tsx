import { Link } from 'react-router-dom';
import { UNIT_SYMBOLS, unitFor } from '@shared/calc/units.calc';
import { paths } from '@/config/paths';
import { useUnits } from '@/lib/units-context';
import { AlignmentCard } from '@/features/calculators/components/alignment-card';
import { CornerBalanceCard } from '@/features/calculators/components/corner-balance-card';
import { DamperCard } from '@/features/calculators/components/damper-card';
import { SpringsCard } from '@/features/calculators/components/springs-card';
import { TyreCard } from '@/features/calculators/components/tyre-card';

/** The calculators in page order, each with the anchor its link jumps to. */
const CALCULATORS = [
  { id: 'corner-balance', name: 'Corner balance', Card: CornerBalanceCard },
  { id: 'springs', name: 'Springs', Card: SpringsCard },
  { id: 'tyres', name: 'Tyre size and pressure', Card: TyreCard },
  { id: 'alignment', name: 'Toe and camber', Card: AlignmentCard },
  { id: 'dampers', name: 'Damper length', Card: DamperCard },
] as const;

/**
 * The shop calculators: corner balance and wedge, springs, tyre size and pressure, toe and camber, damper length and
 * droop. Typed in the user's units, worked out by the shared calculations in SI. Meant for /calculators.
 */
export function CalculatorsPage() {
  const units = useUnits();
  const inUse = (['length', 'mass', 'springRate', 'pressure', 'temperature'] as const)
    .map((q) => UNIT_SYMBOLS[unitFor(q, units)])
    .join(', ');
  return (
    <div className="flex flex-col gap-6">
      <title>Calculators · Scrubline</title>
      <div className="flex flex-col gap-2">
        <h1 className="text-3xl font-extrabold">Calculators</h1>
        <p className="text-ink-muted">
          Planning aids for the garage. Results update as you type, in your units ({inUse});{' '}
          <Link to={paths.settings} className="font-semibold text-link underline">
            change units in Settings
          </Link>
          .
        </p>
        {/* The page is long on a phone: each calculator is a tap away, not a scroll past the others' cautions. */}
        <nav aria-label="Jump to a calculator">
          <ul className="flex flex-wrap gap-2">
            {CALCULATORS.map(({ id, name }) => (
              <li key={id}>
                <a
                  href={`#${id}`}
                  // Scrolled to in place, with the focus: the address and the history stay as they are, so Back
                  // leaves the page. A click with a modifier key (a new tab) is the browser's.
                  onClick={(e) => {
                    if (e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
                    e.preventDefault();
                    const target = document.getElementById(id);
                    target?.scrollIntoView({ block: 'start' });
                    target?.focus({ preventScroll: true });
                  }}
                  className="inline-flex min-h-tap items-center rounded-full border border-line-strong bg-surface px-4 font-semibold text-link"
                >
                  {name}
                </a>
              </li>
            ))}
          </ul>
        </nav>
      </div>
      <div className="grid grid-cols-1 items-start gap-4 lg:grid-cols-2">
        {CALCULATORS.map(({ id, Card }) => (
          // Clear of the sticky top bar when jumped to.
          <div key={id} id={id} tabIndex={-1} className="scroll-mt-20 focus:outline-none">
            <Card />
          </div>
        ))}
      </div>
    </div>
  );
}
