import { Caution } from '@/components/ui/caution';

/** Beside the alignment, ride-height and corner-weight readings: the usual cautions for that work (common practice). */
export function MeasurementCautions() {
  return (
    <Caution>
      <ul className="list-disc pl-4">
        <li>Never work under a car held up by a jack alone: use rated axle stands on firm, level ground.</li>
        <li>Tighten wheel nuts and suspension bolts to the vehicle and parts makers’ torque figures.</li>
        <li>Set cold tyre pressures to the vehicle or tyre maker’s figures before the car is driven.</li>
      </ul>
    </Caution>
  );
}

/** On the handover sheet the customer takes away: what to do before racing on the new setup (common practice). */
export function HandoverCautions() {
  return (
    <Caution title="Before you drive">
      <ul className="list-disc pl-4">
        <li>Check the wheel nuts’ torque again after the first short drive, to the vehicle maker’s figure.</li>
        <li>Set cold tyre pressures to the vehicle or tyre maker’s figures.</li>
        <li>Drive gently at first to feel the changes before you compete.</li>
        <li>Follow the event’s rules, and have further work done by a qualified technician.</li>
      </ul>
    </Caution>
  );
}
