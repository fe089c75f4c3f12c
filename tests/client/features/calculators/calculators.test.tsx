// @vitest-environment jsdom
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { IMPERIAL_PREFERENCES, METRIC_PREFERENCES, type UnitPreferences } from '../../../../shared/calc/units.calc';
import { UnitsProvider } from '@/lib/units-context';
import { CalculatorsPage } from '@/app/routes/calculators/calculators';
import { renderWithQueryClient, stubFetch, type StubRoutes } from '../../test-utils';
import { CAR, list } from '../../fixtures/season';

/*
 * Expected values are worked by hand from published formulas (each case names its source); the calculators
 * must show them in the user's units, live as the numbers are typed.
 */

afterEach(cleanup);

/** The page in the given units; the user's cars (none unless given) are asked for by the tyre card. */
function renderPage(units: UnitPreferences, routes: StubRoutes = { 'GET /api/cars': list([]) }) {
  stubFetch(routes);
  renderWithQueryClient(
    <MemoryRouter>
      <UnitsProvider units={units}>
        <CalculatorsPage />
      </UnitsProvider>
    </MemoryRouter>,
  );
  return userEvent.setup();
}

const card = (name: string) => within(screen.getByRole('region', { name }));

/** The value shown beside a result's name inside one results list. */
function result(listName: string, term: string): string {
  const list = within(screen.getByLabelText(listName));
  return list.getByText(term).nextElementSibling?.textContent ?? '';
}

describe('corner balance and wedge calculator', () => {
  it('when 720/680/610/590 are typed in lb, then it shows total 2600 lb, front 53.85 %, left 51.15 % and cross 50.38 %', async () => {
    // Worked by hand (common practice; Hotchkis; Schroeder "Understanding Corner Weights").
    const u = renderPage(IMPERIAL_PREFERENCES);
    const balance = card('Corner balance and wedge');
    await u.type(balance.getByLabelText('Left front weight'), '720');
    await u.type(balance.getByLabelText('Right front weight'), '680');
    await u.type(balance.getByLabelText('Left rear weight'), '610');
    await u.type(balance.getByLabelText('Right rear weight'), '590');

    expect(result('Corner balance', 'Total')).toBe('2600 lb');
    expect(result('Corner balance', 'Front')).toBe('53.85 %');
    expect(result('Corner balance', 'Left')).toBe('51.15 %');
    expect(result('Corner balance', 'Cross (LF + RR)')).toBe('50.38 %');
    expect(result('Corner balance', 'Other diagonal (RF + LR)')).toBe('49.62 %');
    // Scrubline's definition of cross is said on screen.
    expect(balance.getByText(/the other diagonal \(RF \+ LR/)).toBeTruthy();
  });

  it('when the left front wheel moves 0.25 in on 200 lb/in wheel rates, then LF gains 12.5 lb and cross goes 50.38 % → 51.35 %', async () => {
    // Perch change, rigid-chassis statics worked by hand: all k_w = 200 lbf/in, δ = 0.25 in → X = 12.5 lb; 50.38 % → 51.35 %.
    const u = renderPage(IMPERIAL_PREFERENCES);
    const balance = card('Corner balance and wedge');
    for (const [corner, lb] of [['Left front', '720'], ['Right front', '680'], ['Left rear', '610'], ['Right rear', '590']] as const) {
      await u.type(balance.getByLabelText(`${corner} weight`), lb);
      await u.type(balance.getByLabelText(`${corner} wheel rate`), '200');
    }
    await u.type(balance.getByLabelText('Wheel moves by'), '0.25');

    const change = within(balance.getByRole('group', { name: 'Change in corner weight (lb)' }));
    expect(within(change.getByRole('group', { name: 'Left front' })).getByText('+12.5 lb')).toBeTruthy();
    expect(within(change.getByRole('group', { name: 'Right front' })).getByText('−12.5 lb')).toBeTruthy();
    expect(within(change.getByRole('group', { name: 'Right rear' })).getByText('+12.5 lb')).toBeTruthy();
    expect(result('Perch change', 'Cross (LF + RR)')).toBe('50.38 % → 51.35 %');
    expect(balance.getByText(/rigid-chassis approximation: ignores anti-roll bars, tyre stiffness and chassis flex/i)).toBeTruthy();
  });

  it('when a corner weight is not a number, then that field says so and no balance is shown', async () => {
    const u = renderPage(METRIC_PREFERENCES);
    const balance = card('Corner balance and wedge');
    await u.type(balance.getByLabelText('Left front weight'), '32a');

    expect(balance.getByLabelText('Left front weight').getAttribute('aria-invalid')).toBe('true');
    // The example is a typical corner weight, 300 kg.
    expect(balance.getByText('Type a number, e.g. 300')).toBeTruthy();
    expect(within(screen.getByLabelText('Corner balance')).queryByText('Cross (LF + RR)')).toBeNull();
  });
});

describe('corner weight plausibility', () => {
  async function typeWeights(u: ReturnType<typeof userEvent.setup>, weights: readonly [string, string, string, string]) {
    const balance = card('Corner balance and wedge');
    const corners = ['Left front', 'Right front', 'Left rear', 'Right rear'] as const;
    for (const [i, corner] of corners.entries()) await u.type(balance.getByLabelText(`${corner} weight`), weights[i]!);
    return balance;
  }

  it('when a corner reads 99999 kg, then the balance still shows, with a warning that names the 1500 kg and 5000 kg limits', async () => {
    // Worked by hand: 99999 + 680 + 610 + 590 = 101879 kg; cross (99999 + 590) / 101879 = 98.73 %.
    const u = renderPage(METRIC_PREFERENCES);
    const balance = await typeWeights(u, ['99999', '680', '610', '590']);

    expect(result('Corner balance', 'Total')).toBe('101879.0 kg');
    expect(result('Corner balance', 'Cross (LF + RR)')).toBe('98.73 %');
    expect(balance.getByRole('alert').textContent).toMatch(
      /outside what a club car weighs \(up to 1500 kg at a corner, 5000 kg in all\)\. Check them/,
    );
    // The cautions about scales and jacking stay beside it.
    expect(balance.getByText(/never work under a car held by a jack alone/)).toBeTruthy();
  });

  it('when the readings are those of a club car, then no warning shows', async () => {
    // 720/680/610/590 kg: 2600 kg in all, no corner above 1500 kg.
    const u = renderPage(METRIC_PREFERENCES);
    const balance = await typeWeights(u, ['720', '680', '610', '590']);
    expect(result('Corner balance', 'Total')).toBe('2600.0 kg');
    expect(balance.queryByRole('alert')).toBeNull();
  });

  it('when each corner reads 3000 lb, then the 12000 lb total alone brings the warning, its limits said in lb', async () => {
    // 1 lb = 0.453 592 37 kg exactly (NIST Handbook 44, Appendix C), worked by hand: 3000 lb = 1360.8 kg, under
    // 1500 kg; 12000 lb = 5443.1 kg, over 5000 kg. The limits in lb: 1500 / 0.45359237 = 3306.9 → 3307 lb,
    // 5000 / 0.45359237 = 11023.1 → 11023 lb.
    const u = renderPage(IMPERIAL_PREFERENCES);
    const balance = await typeWeights(u, ['3000', '3000', '3000', '3000']);
    expect(result('Corner balance', 'Total')).toBe('12000 lb');
    expect(balance.getByRole('alert').textContent).toMatch(/\(up to 3307 lb at a corner, 11023 lb in all\)/);
  });

  it('when a corner reads 0, or below 0 with either minus sign, then each of those fields says it must be above 0 and no balance shows', async () => {
    const u = renderPage(METRIC_PREFERENCES);
    const balance = await typeWeights(u, ['0', '680', '-610', '\u2212590']);

    for (const corner of ['Left front', 'Left rear', 'Right rear']) {
      expect(balance.getByLabelText(`${corner} weight`).getAttribute('aria-invalid')).toBe('true');
      expect(balance.getByText(`${corner} weight must be above 0`)).toBeTruthy();
    }
    expect(balance.getByLabelText('Right front weight').getAttribute('aria-invalid')).toBeNull();
    expect(within(screen.getByLabelText('Corner balance')).queryByText('Cross (LF + RR)')).toBeNull();
  });
});

describe('springs calculator', () => {
  it('when 500 lb/in at MR 0.65 with a 700 lb sprung corner is typed, then wheel rate 211.3 lb/in and 1.72 Hz show', async () => {
    // Barton & Fieldhouse §3.9 (wheel rate = k·MR², f = (1/2π)√(k/m)): 500 lbf/in at MR 0.65 → 211.25 lbf/in (36.9955 N/mm); 700 lb sprung → 1.718 Hz
    // (Barton & Fieldhouse §3.9; Ortiz, Chassis Newsletter Jan 2002).
    const u = renderPage(IMPERIAL_PREFERENCES);
    const springs = card('Springs');
    await u.type(springs.getByLabelText('Spring rate'), '500');
    await u.type(springs.getByLabelText('Motion ratio'), '0.65');
    expect(result('Wheel rate', 'Wheel rate')).toBe('211.3 lb/in');

    await u.type(springs.getByLabelText('Sprung corner mass'), '700');
    expect(result('Ride frequency', 'Ride frequency')).toBe('1.72 Hz');
  });

  it('when the same spring is typed in N/mm, then the wheel rate shows 37.00 N/mm (36.9955 to two decimals)', async () => {
    // NIST SP 811: 500 lbf/in = 87.5634 N/mm; Barton & Fieldhouse §3.9: × 0.65² = 36.9955 N/mm.
    const u = renderPage(METRIC_PREFERENCES);
    const springs = card('Springs');
    await u.type(springs.getByLabelText('Spring rate'), '87.5634');
    await u.type(springs.getByLabelText('Motion ratio'), '0.65');
    expect(result('Wheel rate', 'Wheel rate')).toBe('37.00 N/mm');
  });

  it('when the spring leans 10°, then cos θ is squared: 80 N/mm at MR 0.75 gives 43.64 N/mm, not 44.32', async () => {
    // Barton & Fieldhouse §3.9 (angled spring, cos² θ): 80 N/mm, MR 0.75, θ = 10° → 43.643 N/mm (single-cos 44.316 must not match).
    const u = renderPage(METRIC_PREFERENCES);
    const springs = card('Springs');
    await u.type(springs.getByLabelText('Spring rate'), '80');
    await u.type(springs.getByLabelText('Motion ratio'), '0.75');
    await u.type(springs.getByLabelText('Spring angle (optional)'), '10');
    expect(result('Wheel rate', 'Wheel rate')).toBe('43.64 N/mm');
  });

  it('when a target frequency is typed, then the wheel rate for it shows: 300 kg at 2.0 Hz needs 47.37 N/mm', async () => {
    // Barton & Fieldhouse §3.9, inverted: 300 kg at 2.0 Hz → 47.374 N/mm.
    const u = renderPage(METRIC_PREFERENCES);
    const springs = card('Springs');
    await u.type(springs.getByLabelText('Sprung corner mass'), '300');
    await u.type(springs.getByLabelText('Target frequency'), '2.0');
    expect(result('Wheel rate for a frequency', 'Wheel rate needed')).toBe('47.37 N/mm');
  });

  it('when the motion ratio is 0, then the calculation’s own message shows at that field', async () => {
    const u = renderPage(METRIC_PREFERENCES);
    const springs = card('Springs');
    await u.type(springs.getByLabelText('Spring rate'), '80');
    await u.type(springs.getByLabelText('Motion ratio'), '0');
    expect(springs.getByText('Motion ratio must be above 0')).toBeTruthy();
    expect(springs.getByLabelText('Motion ratio').getAttribute('aria-invalid')).toBe('true');
  });
});

describe('tyre size and pressure calculator', () => {
  it('when a malformed size is typed, then the field shows the calculation’s message', async () => {
    const u = renderPage(METRIC_PREFERENCES);
    const tyre = card('Tyre size and pressure');
    await u.type(tyre.getByLabelText('Tyre size'), '245/4R18');

    expect(tyre.getByText(/"245\/4R18" is not a tyre size we can read\. Use a size like 245\/40R18/)).toBeTruthy();
    expect(tyre.getByLabelText('Tyre size').getAttribute('aria-invalid')).toBe('true');
  });

  it('when 245/40R18 is typed, then the nominal overall diameter is 653.2 mm', async () => {
    // Worked by hand: 245/40R18 → OD 653.2 mm (ETRTO / TRA conventions).
    const u = renderPage(METRIC_PREFERENCES);
    await u.type(card('Tyre size and pressure').getByLabelText('Tyre size'), '245/40R18');
    expect(result('Nominal tyre dimensions', 'Overall diameter (nominal)')).toBe('653.2 mm');
  });

  it('when the user has cars with tyre sizes, then one tap on a size fills the field and shows its dimensions; each size is offered once', async () => {
    const u = renderPage(METRIC_PREFERENCES, {
      'GET /api/cars': list([
        { ...CAR, id: 'c2222222-2222-4222-8222-222222222222', name: 'Winter hack', tyreSize: null },
        { ...CAR, name: 'Grey roadster', tyreSize: '205/50R15' },
        { ...CAR, id: 'c3333333-3333-4333-8333-333333333333', name: 'Spare shell', tyreSize: '205/50R15' },
      ]),
    });
    const tyre = card('Tyre size and pressure');
    const offered = await tyre.findByRole('group', { name: 'Sizes on your cars' });
    expect(within(offered).getAllByRole('button').map((b) => b.textContent)).toEqual(['Spare shell: 205/50R15']);
    await u.click(within(offered).getByRole('button', { name: 'Spare shell: 205/50R15' }));
    expect((tyre.getByLabelText('Tyre size') as HTMLInputElement).value).toBe('205/50R15');
    expect(within(offered).getByRole('button', { name: 'Spare shell: 205/50R15' }).getAttribute('aria-pressed')).toBe('true');
    // By hand: 205 × 0.50 = 102.5 mm of sidewall; 15 × 25.4 + 2 × 102.5 = 586.0 mm (ETRTO / TRA conventions).
    expect(result('Nominal tyre dimensions', 'Overall diameter (nominal)')).toBe('586.0 mm');
  });

  it('when 200 kPa cold at 15 °C warms to 60 °C, then the hot pressure is 247.1 kPa (absolute pressures scaled)', async () => {
    // Worked by hand with the gas law: 200 kPa at 15 °C → 60 °C: 247.058 kPa (OpenStax College Physics §13.3).
    const u = renderPage(METRIC_PREFERENCES);
    const tyre = card('Tyre size and pressure');
    await u.type(tyre.getByLabelText('Cold pressure'), '200');
    await u.type(tyre.getByLabelText('Cold temperature'), '15');
    await u.type(tyre.getByLabelText('Hot temperature'), '60');
    expect(result('Pressure', 'Hot pressure')).toBe('247.1 kPa');
  });
});

describe('tyre pressure plausibility', () => {
  it('when a temperature no tyre sees is typed, then the result still shows, with a warning to check the numbers', async () => {
    // The gas law answers anyway (OpenStax College Physics §13.3, absolute values): (200 + 101.325) × 1173.15 / 288.15
    // − 101.325 = 1125.5 kPa at 900 °C, far past any tyre.
    const u = renderPage(METRIC_PREFERENCES);
    const tyre = card('Tyre size and pressure');
    await u.type(tyre.getByLabelText('Cold pressure'), '200');
    await u.type(tyre.getByLabelText('Cold temperature'), '15');
    await u.type(tyre.getByLabelText('Hot temperature'), '60');
    expect(tyre.queryByRole('alert')).toBeNull();

    await u.clear(tyre.getByLabelText('Hot temperature'));
    await u.type(tyre.getByLabelText('Hot temperature'), '900');
    expect(result('Pressure', 'Hot pressure')).toBe('1125.5 kPa');
    expect(tyre.getByRole('alert').textContent).toMatch(/outside what a tyre sees in use \([-−]40 °C to 150 °C, up to 450 kPa\)/);
  });
});

describe('toe and camber calculator', () => {
  it('when 1/16 in of toe per wheel is measured across a 24 in rim, then the angle is 0.149°', async () => {
    // Alignment shop guides (x = D·sin θ), worked by hand: 1/16 in per wheel at 24 in → 0.1492°.
    const u = renderPage(IMPERIAL_PREFERENCES);
    const align = card('Toe and camber');
    await u.type(align.getByLabelText('Rim diameter'), '24');
    await u.type(align.getByLabelText('Toe length (front minus rear)'), '0.0625');
    expect(result('Toe', 'Toe angle, across the rim')).toBe('0.149°');
  });
});

describe('damper length and droop calculator', () => {
  it('when 700 lb sits on 500 lb/in at MR 0.65 with 3.5 in of droop, then the spring is 0.121 in short and a helper must make it up', async () => {
    // Common practice, worked by hand: x_s = 2.154 in; 3.5 in wheel droop = 2.275 in at the spring → shortfall 0.121 in.
    const u = renderPage(IMPERIAL_PREFERENCES);
    const damper = card('Damper length and droop');
    await u.type(damper.getByLabelText('Load on the wheel'), '700');
    await u.type(damper.getByLabelText('Spring motion ratio'), '0.65');
    await u.type(damper.getByLabelText('Main spring rate'), '500');
    await u.type(damper.getByLabelText('Wheel droop from ride height'), '3.5');

    expect(result('Droop check', 'Spring compressed at ride height')).toBe('2.154 in');
    expect(result('Droop check', 'Seated at full droop')).toBe('No: short by 0.121 in');
    expect(damper.getByText(/A helper spring must make up 0.121 in of travel/)).toBeTruthy();
  });
});

describe('every calculator', () => {
  it('when the page opens, then each card shows its formula with a source and a caution', () => {
    renderPage(METRIC_PREFERENCES);
    for (const name of ['Corner balance and wedge', 'Springs', 'Tyre size and pressure', 'Toe and camber', 'Damper length and droop']) {
      const c = card(name);
      expect(c.getByText('Formula:')).toBeTruthy();
      expect(c.getByRole('complementary', { name: 'Caution' }).textContent).toMatch(/planning aids, not a substitute for inspection/);
    }
    expect(card('Springs').getByText(/Barton & Fieldhouse/)).toBeTruthy();
  });
});

describe('the example in a field that is not a number', () => {
  it.each([
    // 70 N/mm in lb/in: 1 lbf = 4.448 221 615 260 5 N and 1 in = 25.4 mm exactly (NIST SP 811, appendix B.8),
    // so 70 × 25.4 / 4.448 221 615 = 399.7, to two figures 400.
    ['Springs', 'Spring rate', 'imperial', 'Type a number, e.g. 400'],
    ['Springs', 'Spring rate', 'metric', 'Type a number, e.g. 70'],
    // A motion ratio has no unit.
    ['Springs', 'Motion ratio', 'imperial', 'Type a number, e.g. 0.8'],
    // 20 °C in °F: 20 × 9/5 + 32 = 68 (the definition of the scales, NIST SP 811 §4.2.1.1).
    ['Tyre size and pressure', 'Cold temperature', 'imperial', 'Type a number, e.g. 68'],
    // 200 kPa in psi: 1 psi = 6.894 757 kPa (NIST SP 811, B.8), 29.0, to two figures 29.
    ['Tyre size and pressure', 'Cold pressure', 'imperial', 'Type a number, e.g. 29'],
  ] as const)('when text is typed in the %s card’s %s in %s units, then the message gives an example in those units: %j', async (name, label, units, message) => {
    const u = renderPage(units === 'imperial' ? IMPERIAL_PREFERENCES : METRIC_PREFERENCES);
    const c = card(name);
    await u.type(c.getByLabelText(label), 'abc');
    expect(c.getByText(message)).toBeTruthy();
  });
});

describe('the notes on each card, in the user\'s units', () => {
  it('when the user reads inches and psi, then the damper\'s tolerance hint, the tyre\'s wear note and the atmosphere are in inches and psi, and no mm or kPa is left', () => {
    renderPage(IMPERIAL_PREFERENCES);
    // 13 mm = 0.51 in and 16 mm = 0.63 in (25.4 mm per inch, by definition).
    expect(screen.getByText('Blank: about 0.51 in (common practice: 0.51 in to 0.63 in at most)')).toBeTruthy();
    // 8/32 in off each side of the diameter: 16/32 in = 0.50 in.
    expect(screen.getByText(/about 0\.50 in less diameter from 10\/32 to 2\/32 in of tread/)).toBeTruthy();
    // 101.325 kPa = 14.7 psi (1 psi = 6.894 757 kPa, NIST SP 811; from memory).
    expect(screen.getByText(/a standard atmosphere \(14\.7 psi\)/)).toBeTruthy();
    expect(screen.queryByText(/\d mm\b|kPa/)).toBeNull();
  });

  it('when the user reads mm and kPa, then the same notes are in mm and kPa, the atmosphere to its defined value', () => {
    renderPage(METRIC_PREFERENCES);
    expect(screen.getByText('Blank: about 13.0 mm (common practice: 13.0 mm to 16.0 mm at most)')).toBeTruthy();
    expect(screen.getByText(/about 12\.7 mm less diameter/)).toBeTruthy();
    expect(screen.getByText(/a standard atmosphere \(101\.325 kPa\)/)).toBeTruthy();
  });
});

describe('the calculators page', () => {
  it('when it opens, then a link to each calculator leads to the block that holds it, in page order', () => {
    renderPage(METRIC_PREFERENCES);
    const links = within(screen.getByRole('navigation', { name: 'Jump to a calculator' })).getAllByRole('link');
    const cards = ['Corner balance and wedge', 'Springs', 'Tyre size and pressure', 'Toe and camber', 'Damper length and droop'];

    expect(links).toHaveLength(cards.length);
    links.forEach((link, i) => {
      const target = document.getElementById(link.getAttribute('href')!.slice(1));
      expect(target, link.textContent ?? '').not.toBeNull();
      expect(within(target!).getByRole('region', { name: cards[i] })).toBeTruthy();
    });
  });

  it('when a link is tapped, then the focus moves to that calculator, so a screen reader carries on from there', async () => {
    const u = renderPage(METRIC_PREFERENCES);
    Element.prototype.scrollIntoView ??= () => {};
    await u.click(screen.getByRole('link', { name: 'Toe and camber' }));

    expect(document.activeElement?.id).toBe('alignment');
    expect(within(document.activeElement as HTMLElement).getByRole('region', { name: 'Toe and camber' })).toBeTruthy();
  });
});
