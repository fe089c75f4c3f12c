import type { TeamSharing } from '@shared/collab/team.schema';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { SETUP_SHARING_NOTE, SHARING_OPTIONS } from '../utils/team-words';

/** What the team may see of a car: a segmented choice with its one-sentence explanation. */
export function SharingChoice({
  value,
  onChange,
  name,
  error,
}: {
  value: TeamSharing;
  onChange: (value: TeamSharing) => void;
  name: string;
  error?: string;
}) {
  return (
    <div className="flex flex-col gap-1">
      <SegmentedControl label="What the team sees" name={name} options={SHARING_OPTIONS} value={value} onChange={onChange} />
      <p className="text-sm text-ink-muted">{SETUP_SHARING_NOTE}</p>
      {error ? <p className="text-sm font-semibold text-warning">{error}</p> : null}
    </div>
  );
}
