import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Pencil, Trash2 } from 'lucide-react';
import type { Comment, CommentTarget } from '@shared/collab/comment.schema';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';
import { RelativeTime } from '@/lib/relative-time';
import { useComments } from '../api/get-comments';
import { useCreateComment } from '../api/create-comment';
import { useDeleteComment } from '../api/delete-comment';
import { useUpdateComment } from '../api/update-comment';

const MAX_LENGTH = 4000;
const EMPTY = 'Write a comment';

/** A failed write as words: the comment's own field error, or what concerns the whole form. */
function problemOf(error: unknown): { body: string | null; form: string | null } {
  if (!isApiError(error)) return { body: null, form: 'Something went wrong. Your text is still here; try again.' };
  if (error.code === 'network') return { body: null, form: 'No connection. Your text is still here; send it again when you have signal.' };
  const body = error.fieldErrors.body?.join(' ') ?? null;
  const others = Object.entries(error.fieldErrors)
    .filter(([key]) => key !== 'body')
    .flatMap(([, messages]) => messages);
  const form = others.length ? others.join(' ') : body ? null : error.message;
  return { body, form };
}

interface CommentBoxProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  error: string | null;
  /** Rows shown before the box grows a scroll bar. */
  rows?: number;
}

/** A labelled text box whose error is read out with it. */
function CommentBox({ label, value, onChange, error, rows = 3 }: CommentBoxProps) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        value={value}
        maxLength={MAX_LENGTH}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="w-full rounded border border-line-strong bg-surface p-3 text-base text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-warning"
      />
      {error ? (
        <p id={`${id}-error`} className="text-sm font-semibold text-warning">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function CommentItem({ comment, target }: { comment: Comment; target: CommentTarget }) {
  const update = useUpdateComment(target);
  const remove = useDeleteComment(target);
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [text, setText] = useState(comment.body);
  const [problem, setProblem] = useState<{ body: string | null; form: string | null }>({ body: null, form: null });

  const save = (event: FormEvent) => {
    event.preventDefault();
    if (!text.trim()) {
      setProblem({ body: EMPTY, form: null });
      return;
    }
    setProblem({ body: null, form: null });
    update.mutate(
      { commentId: comment.id, input: { body: text.trim(), version: comment.version } },
      { onSuccess: () => setEditing(false), onError: (error) => setProblem(problemOf(error)) },
    );
  };

  const confirmDelete = () => {
    setProblem({ body: null, form: null });
    remove.mutate(comment.id, { onError: (error) => setProblem(problemOf(error)) });
  };

  return (
    <li className="flex flex-col gap-1 rounded border border-line bg-surface p-3">
      <p className="flex flex-wrap items-baseline gap-x-2 text-sm">
        <span className="font-bold text-ink">
          {comment.author.displayName}
          {comment.shop ? <span className="font-semibold text-ink-muted"> · {comment.shop.name}</span> : null}
        </span>
        <RelativeTime iso={comment.createdAt} className="tabular-figures text-ink-muted" />
        {comment.editedAt ? <span className="text-ink-muted">(edited)</span> : null}
      </p>
      {editing ? (
        <form onSubmit={save} noValidate aria-label="Edit comment" className="flex flex-col gap-2">
          <CommentBox label="Your comment" value={text} onChange={setText} error={problem.body} />
          <FormAlert message={problem.form} />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" isPending={update.isPending} pendingLabel="Saving…">
              Save
            </Button>
            <Button
              variant="secondary"
              onClick={() => {
                setEditing(false);
                setText(comment.body);
                setProblem({ body: null, form: null });
              }}
            >
              Cancel
            </Button>
          </div>
        </form>
      ) : (
        <p className="wrap-anywhere whitespace-pre-wrap">{comment.body}</p>
      )}
      {comment.mine && !editing ? (
        confirming ? (
          <div role="group" aria-label="Delete this comment?" className="flex flex-col gap-2 rounded border border-warning-line bg-warning-surface p-2">
            <p className="font-semibold">Delete this comment? It cannot be brought back.</p>
            <FormAlert message={problem.form} />
            <div className="flex flex-wrap gap-2">
              <Button variant="danger" onClick={confirmDelete} isPending={remove.isPending} pendingLabel="Deleting…">
                Delete comment
              </Button>
              <Button variant="secondary" onClick={() => setConfirming(false)}>
                Keep
              </Button>
            </div>
          </div>
        ) : (
          <div className="flex flex-wrap gap-1">
            <Button variant="quiet" className="px-2" onClick={() => setEditing(true)}>
              <Pencil aria-hidden="true" className="size-4" /> Edit<span className="sr-only"> your comment</span>
            </Button>
            <Button variant="quiet" className="px-2" onClick={() => setConfirming(true)}>
              <Trash2 aria-hidden="true" className="size-4" /> Delete<span className="sr-only"> your comment</span>
            </Button>
          </div>
        )
      ) : null}
    </li>
  );
}

function NewComment({ target }: { target: CommentTarget }) {
  const create = useCreateComment();
  const [text, setText] = useState('');
  // Made once per comment and kept until the server has it: sending again after a lost answer never posts twice.
  const [id, setId] = useState(() => crypto.randomUUID());
  const [problem, setProblem] = useState<{ body: string | null; form: string | null }>({ body: null, form: null });

  const send = (event: FormEvent) => {
    event.preventDefault();
    if (!text.trim()) {
      setProblem({ body: EMPTY, form: null });
      return;
    }
    setProblem({ body: null, form: null });
    create.mutate(
      { id, target, body: text.trim() },
      {
        onSuccess: () => {
          setText('');
          setId(crypto.randomUUID());
        },
        onError: (error) => setProblem(problemOf(error)),
      },
    );
  };

  return (
    <form onSubmit={send} noValidate aria-label="Write a comment" className="flex flex-col gap-2">
      <CommentBox
        label="Add a comment"
        value={text}
        onChange={(v) => {
          setText(v);
          if (problem.body) setProblem((p) => ({ ...p, body: null }));
        }}
        error={problem.body}
      />
      <FormAlert message={problem.form} />
      <div>
        <Button type="submit" isPending={create.isPending} pendingLabel="Sending…">
          Send
        </Button>
      </div>
    </form>
  );
}

/**
 * One conversation about a run, a car's day at an event, a setup snapshot or a tread reading:
 * the car's drivers and its shop, oldest first, each name with the shop it writes for.
 */
export function CommentThread({ target, label = 'Comments' }: { target: CommentTarget; label?: string }) {
  const { data, isPending, isError } = useComments(target);
  return (
    <section aria-label={label} className="flex flex-col gap-3">
      {isPending ? (
        <p className="text-ink-muted">Loading comments…</p>
      ) : isError ? (
        <p className="text-ink-muted">Comments could not be loaded. Try again when you have signal.</p>
      ) : data.items.length === 0 ? (
        <p className="text-ink-muted">No comments yet.</p>
      ) : (
        <ol className="flex flex-col gap-2" aria-label={`${label}, oldest first`}>
          {data.items.map((comment) => (
            <CommentItem key={`${comment.id}-${comment.version}`} comment={comment} target={target} />
          ))}
        </ol>
      )}
      <NewComment target={target} />
    </section>
  );
}

interface CommentDialogProps {
  target: CommentTarget;
  title: string;
  open: boolean;
  onOpenChange: (open: boolean) => void;
  /** More about the same record above the thread (the app adds its photos). */
  children?: ReactNode;
}

/**
 * A thread over the page, for the trackside screen: the shell's comments host (comments-host.tsx)
 * loads it on the first tap, so the screen that logs runs does not carry it.
 */
export function CommentDialog({ target, title, open, onOpenChange, children }: CommentDialogProps) {
  return (
    <Dialog open={open} onOpenChange={onOpenChange} title={title}>
      <div className="flex max-h-[70dvh] flex-col gap-3 overflow-y-auto">
        {children}
        <CommentThread target={target} label={title} />
      </div>
    </Dialog>
  );
}
