import { cautionWords, suggestionCautions } from '@shared/collab/suggestion-cautions.calc';
import type { SuggestionChange, SuggestionPreviewCell } from '@shared/collab/suggestion.schema';
import type { PerCorner } from '@shared/season/corners';
import type { SetupCorner } from '@shared/season/setup.schema';
import { Caution } from '@/components/ui/caution';
import { useUnits } from '@/lib/units-context';

/** The shop's advice, before sending and after. */
const SHOP_ADVICE =
  'The vehicle and tyre makers’ figures, the event’s rules and local law come first. Whoever makes the change should be qualified to do it, re-check wheel and suspension torque and the alignment afterwards, and set pressures cold.';

/** What each side is told around the list: the shop before sending and after, the driver before accepting. */
const WORDS = {
  shop: {
    intro:
      'Some of these values are far from what a road car on street or track tyres usually runs. Check each one before sending; if you mean it, say why above so the driver knows.',
    advice: SHOP_ADVICE,
  },
  /** The shop reading its own suggestion after sending it, while the driver decides. */
  sent: {
    intro:
      'Some of these values are far from what a road car on street or track tyres usually runs. The driver sees this caution before deciding; if one is a slip, tell them in the comments.',
    advice: SHOP_ADVICE,
  },
  driver: {
    intro: 'Some of these values are far from what a road car on street or track tyres usually runs. Before you accept, ask the shop to confirm them.',
    advice:
      'The vehicle and tyre makers’ figures, the event’s rules and local law come first. Have the change made by someone qualified, re-check wheel and suspension torque and the alignment afterwards, and set pressures cold.',
  },
} as const;

/** The values on the car before the changes, as a suggestion's preview gives them (each corner's first "from"). */
export function valuesBefore(cells: readonly SuggestionPreviewCell[]): PerCorner<SetupCorner> {
  const values: PerCorner<SetupCorner> = {};
  for (const { corner, field, from } of cells) {
    const at = (values[corner] ??= {});
    if (!(field in at)) at[field] = from;
  }
  return values;
}

interface UnusualValuesProps {
  changes: readonly SuggestionChange[];
  /** The values on the car the changes apply to; null when unknown (only the steps by an amount are checked then). */
  current: PerCorner<SetupCorner> | null;
  side: keyof typeof WORDS;
}

/**
 * A caution listing each value the changes would leave far from the usual (camber −7°, 70 kPa cold), or each step
 * far larger than a usual one, in the user's units. Nothing when there is none: it warns, it never stops anyone.
 */
export function UnusualValues({ changes, current, side }: UnusualValuesProps) {
  const units = useUnits();
  const cautions = suggestionCautions(changes, current);
  if (cautions.length === 0) return null;
  const words = WORDS[side];
  return (
    <Caution title="Unusual values">
      <p>{words.intro}</p>
      <ul className="tabular-figures list-disc pl-4">
        {cautions.map((caution) => {
          const text = cautionWords(caution, units);
          return <li key={text}>{text}</li>;
        })}
      </ul>
      <p>{words.advice}</p>
    </Caution>
  );
}
