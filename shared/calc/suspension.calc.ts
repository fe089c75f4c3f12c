/**
 * Wheel rate and ride frequency.
 *
 * Motion ratio MR = spring travel / wheel travel. Wheel rate k_w = k_s·MR²·cos²θ, θ being the spring's inclination
 * from the path of its mount (leave θ at 0 when MR was measured along the spring axis). MR is squared because the
 * spring both moves less than the wheel and pushes on it through the same lever; cos θ is squared for the same
 * reason. A single cos θ is a common mistake.
 * Ride frequency f = (1/2π)·√(k/m), k in N/m, m the sprung mass on that corner (kg); the tyre, when given, acts
 * in series: k_ride = k_w·k_t/(k_w + k_t).
 * Sources: Barton & Fieldhouse, Automotive Chassis Engineering (Springer 2018) §3.9 eqs 3.29–3.33; Mark Ortiz,
 * Chassis Newsletter Jan 2002 "Suspension natural frequencies" (f = .159·√(S/m)).
 */
import { requireFinite, requirePositive } from './input-checks.calc';

const N_PER_M_PER_N_PER_MM = 1000;

/** Springs in series: the combined rate is always below the softer of the two. */
const inSeries = (a: number, b: number) => (a * b) / (a + b);

/** Wheel rate, N/mm, from the spring rate (N/mm), the motion ratio and the spring's inclination (degrees). */
export function wheelRateNPerMm(input: { springRateNPerMm: number; motionRatio: number; springAngleDeg?: number }): number {
  const k = requirePositive('Spring rate', input.springRateNPerMm);
  const mr = requirePositive('Motion ratio', input.motionRatio);
  const angleDeg = requireFinite('Spring angle', input.springAngleDeg ?? 0);
  if (!(Math.abs(angleDeg) < 90)) throw new RangeError('Spring angle must be between −90° and 90°');
  const cos = Math.cos((angleDeg * Math.PI) / 180);
  return k * mr * mr * cos * cos;
}

/**
 * Ride (natural) frequency of one corner, Hz, from its wheel rate (N/mm) and sprung mass (kg). With the tyre's
 * vertical rate (N/mm) the tyre is taken in series with the wheel rate, which lowers the frequency a little.
 */
export function rideFrequencyHz(input: { wheelRateNPerMm: number; sprungMassKg: number; tyreRateNPerMm?: number }): number {
  const kw = requirePositive('Wheel rate', input.wheelRateNPerMm);
  const m = requirePositive('Sprung mass', input.sprungMassKg);
  const kRide = input.tyreRateNPerMm === undefined ? kw : inSeries(kw, requirePositive('Tyre rate', input.tyreRateNPerMm));
  return Math.sqrt((kRide * N_PER_M_PER_N_PER_MM) / m) / (2 * Math.PI);
}

/**
 * The wheel rate (N/mm) that gives a chosen ride frequency with a sprung corner mass: k = m·(2πf)².
 * With the tyre's rate the answer is the wheel rate that, in series with the tyre, gives that frequency.
 * @throws RangeError when the frequency asks for a ride rate at or above the tyre's own rate (no spring can give it).
 */
export function wheelRateForFrequencyNPerMm(input: { frequencyHz: number; sprungMassKg: number; tyreRateNPerMm?: number }): number {
  const f = requirePositive('Frequency', input.frequencyHz);
  const m = requirePositive('Sprung mass', input.sprungMassKg);
  const omega = 2 * Math.PI * f;
  const kRide = (m * omega * omega) / N_PER_M_PER_N_PER_MM;
  if (input.tyreRateNPerMm === undefined) return kRide;
  const kt = requirePositive('Tyre rate', input.tyreRateNPerMm);
  if (!(kRide < kt)) throw new RangeError('That frequency needs a ride rate above the tyre\'s own rate: no spring can give it');
  return (kRide * kt) / (kt - kRide);
}
