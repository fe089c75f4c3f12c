import { useState, type FormEvent } from 'react';
import { Check } from 'lucide-react';
import type { Suggestion } from '@shared/collab/suggestion.schema';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { fromLocalInputValue, toLocalInputValue } from '@/lib/dates';
import { useSetups } from '@/features/setups/api/get-setups';
import { setupInForce } from '@/features/setups/utils/setup-views';
import { useAcceptSuggestion, useDeclineSuggestion } from '../api/decide-suggestion';
import { previewChanges } from '../utils/change-rows';
import { ChangePreview } from './change-preview';
import { setupOnCarPage } from './suggestion-details';
import { TextArea } from '@/components/ui/text-area';
import { UnusualValues, valuesBefore } from './unusual-values';

type Errors = Record<string, string>;

/** The values the changes would apply to if accepted now: the setup the car runs on now, when it can take them. */
const valuesNow = ({ now, preview }: Suggestion) => valuesBefore(now && now.problems.length === 0 ? now.preview : preview);

/** A failed decision as field messages and a message for the whole form. */
function problemsOf(error: unknown): { fields: Errors; form: string | null } {
  if (!isApiError(error)) return { fields: {}, form: 'Something went wrong; try again.' };
  if (error.code === 'network') return { fields: {}, form: 'No connection. Nothing was lost; try again when you have signal.' };
  const fields = Object.fromEntries(Object.entries(error.fieldErrors).map(([k, v]) => [k, v.join(' ')]));
  return { fields, form: error.hasFieldErrors ? null : error.message };
}

/** A form's field messages and its message for the whole form, and how a failed decision fills them. */
function useProblems() {
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const showFailure = (error: unknown) => {
    const { fields, form } = problemsOf(error);
    setErrors(fields);
    setFormError(form);
  };
  return { errors, setErrors, formError, setFormError, showFailure };
}

function AcceptForm({ suggestion, onCancel, onAccepted }: { suggestion: Suggestion; onCancel: () => void; onAccepted: (setupId: string) => void }) {
  const accept = useAcceptSuggestion(suggestion);
  // The new snapshot's id, made once: pressing again after a lost answer never records a second setup.
  const [setupId] = useState(() => crypto.randomUUID());
  const [when, setWhen] = useState(() => toLocalInputValue(new Date()));
  const [label, setLabel] = useState('');
  const { errors, setErrors, formError, setFormError, showFailure } = useProblems();
  // The changes apply to the setup in force when they take effect, as the server applies them: when that is no
  // longer the one the shop wrote them against, the driver sees what they would really record.
  const { data: setups } = useSetups(suggestion.carId);
  const start = setupInForce(setups?.items ?? [], fromLocalInputValue(when) ?? new Date().toISOString());
  const moved = start && start.id !== suggestion.baseSetup.id ? start : null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const effectiveFrom = fromLocalInputValue(when);
    if (!effectiveFrom) {
      setErrors({ effectiveFrom: 'Pick the date and time the car runs with these changes' });
      return;
    }
    setErrors({});
    accept.mutate(
      { setupId, effectiveFrom, ...(label.trim() ? { label: label.trim() } : {}) },
      { onSuccess: () => onAccepted(setupId), onError: showFailure },
    );
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Accept the suggestion" className="flex flex-col gap-3">
      <p className="text-sm">Accepting records a new setup snapshot with these changes. Your runs from then on are tied to it.</p>
      <TextField
        label="Takes effect from"
        hint="When the car first runs with the changes made."
        type="datetime-local"
        value={when}
        error={errors.effectiveFrom}
        onChange={(e) => setWhen(e.target.value)}
      />
      {moved ? (
        <section aria-label="What accepting records now" className="flex flex-col gap-2 rounded border-2 border-warning p-3">
          <p className="text-sm font-semibold">
            At the time you chose, the car runs on “{moved.label}”, not on “{suggestion.baseSetup.label}”, the setup the shop wrote this
            for. Accepting applies the changes to “{moved.label}” and records:
          </p>
          <ChangePreview cells={previewChanges(moved, suggestion.changes)} />
        </section>
      ) : null}
      <UnusualValues side="driver" changes={suggestion.changes} current={start ? start.corners : valuesNow(suggestion)} />
      <TextField
        label="Label for the new setup (optional)"
        placeholder={suggestion.title}
        maxLength={80}
        value={label}
        error={errors.label}
        onChange={(e) => setLabel(e.target.value)}
      />
      <FormAlert message={formError ?? errors.setupId ?? null} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" isPending={accept.isPending} pendingLabel="Accepting…">
          <Check aria-hidden="true" className="size-5" /> Accept and record the setup
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function DeclineForm({ suggestion, onCancel }: { suggestion: Suggestion; onCancel: () => void }) {
  const decline = useDeclineSuggestion(suggestion);
  const [note, setNote] = useState('');
  const { errors, setErrors, formError, setFormError, showFailure } = useProblems();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    if (!note.trim()) {
      setErrors({ note: 'Say why, so the shop knows' });
      return;
    }
    setErrors({});
    decline.mutate({ note: note.trim() }, { onError: showFailure });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Decline the suggestion" className="flex flex-col gap-3">
      <TextArea
        label="Why not?"
        hint="The shop sees this note."
        value={note}
        maxLength={2000}
        rows={3}
        error={errors.note}
        onChange={(v) => {
          setNote(v);
          setErrors({});
        }}
      />
      <FormAlert message={formError} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" isPending={decline.isPending} pendingLabel="Declining…">
          Decline
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** For the car's drivers while the suggestion is open: take it as a new setup, or turn it down with a note. */
export function DecisionPanel({ suggestion, onAccepted }: { suggestion: Suggestion; onAccepted?: (setupId: string) => void }) {
  const [choice, setChoice] = useState<'accept' | 'decline' | null>(null);
  const [acceptedId, setAcceptedId] = useState<string | null>(null);

  if (acceptedId) {
    return (
      <div role="status" className="flex flex-col gap-2 rounded border border-line bg-success-surface p-3">
        <p className="font-semibold text-success">Accepted. The new setup is recorded.</p>
        <Link to={setupOnCarPage(suggestion.carId, acceptedId)} className="inline-flex min-h-tap items-center self-start font-semibold text-link underline">
          Open the new setup on the car’s page
        </Link>
      </div>
    );
  }
  if (suggestion.status !== 'open') return null;
  if (choice === 'accept') {
    return (
      <AcceptForm
        suggestion={suggestion}
        onCancel={() => setChoice(null)}
        onAccepted={(setupId) => {
          setAcceptedId(setupId);
          onAccepted?.(setupId);
        }}
      />
    );
  }
  if (choice === 'decline') return <DeclineForm suggestion={suggestion} onCancel={() => setChoice(null)} />;
  return (
    <div className="flex flex-col gap-3">
      <UnusualValues side="driver" changes={suggestion.changes} current={valuesNow(suggestion)} />
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => setChoice('accept')}>
          <Check aria-hidden="true" className="size-5" /> Accept
        </Button>
        <Button variant="secondary" onClick={() => setChoice('decline')}>
          Decline
        </Button>
      </div>
    </div>
  );
}
