import { useId, useState, type ChangeEvent } from 'react';
import { Camera, FileText, ImageIcon, Trash2 } from 'lucide-react';
import type { Attachment, AttachmentTarget } from '@shared/files/attachment.schema';
import { Button, buttonClasses } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-alert';
import { useOnlineStatus } from '@/hooks/use-online-status';
import { cn } from '@/lib/cn';
import { attachmentFileUrl, attachmentThumbnailUrl } from '../api/attachment-keys';
import { useDeleteAttachment } from '../api/delete-attachment';
import { useAttachments } from '../api/get-attachments';
import { NEEDS_CONNECTION_MESSAGE, useUploadAttachments } from '../api/upload-attachments';

/**
 * What the picker offers. `image/*` is what lets a phone offer its camera beside the gallery; a
 * `capture` attribute would force the camera and hide photos already taken, so there is none.
 */
export const ACCEPTED_FILES = 'image/*,application/pdf';

const fileWords = (n: number) => `${n} ${n === 1 ? 'file' : 'files'}`;

function Tile({ attachment, onDelete }: { attachment: Attachment; onDelete: (() => void) | null }) {
  const isPdf = attachment.contentType === 'application/pdf';
  const Icon = isPdf ? FileText : ImageIcon;
  return (
    <li className="flex w-24 flex-col gap-1">
      <a
        href={attachmentFileUrl(attachment.id)}
        target="_blank"
        rel="noopener noreferrer"
        className="block size-24 overflow-hidden rounded border border-line bg-surface-raised"
      >
        {attachment.hasThumbnail ? (
          <img
            src={attachmentThumbnailUrl(attachment.id)}
            alt={`Photo: ${attachment.fileName}`}
            width={96}
            height={96}
            loading="lazy"
            className="size-full object-cover"
          />
        ) : (
          <span className="flex size-full flex-col items-center justify-center gap-1 p-1 text-center">
            <Icon aria-hidden="true" className="size-8 shrink-0 text-ink-muted" />
            <span className="line-clamp-2 text-xs break-all">
              <span className="sr-only">{isPdf ? 'PDF: ' : 'Photo: '}</span>
              {attachment.fileName}
            </span>
          </span>
        )}
        <span className="sr-only"> (opens in a new tab)</span>
      </a>
      {onDelete ? (
        <Button variant="quiet" className="px-1 text-sm" onClick={onDelete} aria-label={`Delete ${attachment.fileName}`}>
          <Trash2 aria-hidden="true" className="size-4" /> Delete
        </Button>
      ) : null}
    </li>
  );
}

interface AttachmentStripProps {
  target: AttachmentTarget;
  /** What the files are on, to finish "Photos and files on …": "the Set B reading", "run 3". */
  what: string;
  /** False where the viewer may only look (the server refuses others' uploads anyway). */
  canAdd?: boolean;
  /** False under a toggle that already says "Photos and files". */
  heading?: boolean;
}

/**
 * The photos and files on one record: thumbnails in a wrapping grid, each opening the full file in
 * a new tab, an "Add photos" button (a phone offers its camera), and a delete for whoever may.
 * Uploads go straight to the server; with no signal they are refused, never queued.
 */
export function AttachmentStrip({ target, what, canAdd = true, heading = true }: AttachmentStripProps) {
  const headingId = useId();
  const list = useAttachments(target);
  const upload = useUploadAttachments(target);
  const remove = useDeleteAttachment(target);
  const [confirming, setConfirming] = useState<Attachment | null>(null);
  const [added, setAdded] = useState<number | null>(null);
  const online = useOnlineStatus();

  const choose = (event: ChangeEvent<HTMLInputElement>) => {
    const files = Array.from(event.target.files ?? []);
    // Emptied, so choosing the same photo again after a failure still counts as a change.
    event.target.value = '';
    if (files.length === 0) return;
    setAdded(null);
    upload.mutate(files, { onSuccess: (answer) => setAdded(answer.count) });
  };

  const confirmDelete = () => {
    if (!confirming) return;
    remove.mutate(confirming.id, { onSuccess: () => setConfirming(null) });
  };

  const items = list.data?.items ?? [];
  return (
    <section
      aria-labelledby={heading ? headingId : undefined}
      aria-label={heading ? undefined : `Photos and files on ${what}`}
      className="flex flex-col gap-2"
    >
      {heading ? (
        <h3 id={headingId} className="font-bold">
          Photos and files<span className="sr-only"> on {what}</span>
        </h3>
      ) : null}
      {list.isPending ? (
        <p className="text-sm text-ink-muted">Loading photos…</p>
      ) : list.isError ? (
        <p className="text-sm text-ink-muted">Photos could not be loaded. Try again when you have signal.</p>
      ) : items.length === 0 ? (
        <p className="text-sm text-ink-muted">No photos yet.</p>
      ) : (
        <ul className="flex flex-wrap gap-2" aria-label={`Photos and files on ${what}`}>
          {items.map((a) => (
            <Tile
              key={a.id}
              attachment={a}
              onDelete={
                a.canDelete
                  ? () => {
                      remove.reset();
                      setConfirming(a);
                    }
                  : null
              }
            />
          ))}
        </ul>
      )}
      {canAdd ? (
        <div className="flex flex-col gap-2">
          <label
            className={cn(
              buttonClasses('secondary', 'min-h-tap-lg cursor-pointer self-start'),
              'has-[input:focus-visible]:outline-3 has-[input:focus-visible]:outline-offset-2 has-[input:focus-visible]:outline-(--sl-focus)',
              upload.isPending && 'pointer-events-none opacity-60',
            )}
          >
            <Camera aria-hidden="true" className="size-5" />
            {upload.isPending ? 'Adding…' : 'Add photos'}
            <span className="sr-only"> to {what}</span>
            <input
              type="file"
              accept={ACCEPTED_FILES}
              multiple
              className="sr-only"
              disabled={upload.isPending}
              onChange={choose}
            />
          </label>
          <p role="status" className="text-sm text-ink-muted">
            {upload.isPending
              ? `Uploading ${fileWords(upload.variables?.length ?? 0)}… keep this page open.`
              : added !== null
                ? `Added ${fileWords(added)}.`
                : online || upload.isError
                  ? ''
                  : NEEDS_CONNECTION_MESSAGE}
          </p>
          <FormAlert message={upload.isError ? upload.error.message : null} />
        </div>
      ) : null}
      <Dialog
        open={confirming !== null}
        onOpenChange={(open) => {
          if (!open) setConfirming(null);
        }}
        title="Delete this file?"
        description={confirming ? `“${confirming.fileName}” will be gone for everyone who can see ${what}.` : undefined}
      >
        <FormAlert message={remove.isError ? remove.error.message : null} />
        <div className="flex flex-wrap gap-2">
          <Button variant="danger" onClick={confirmDelete} isPending={remove.isPending} pendingLabel="Deleting…">
            Delete
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(null)}>
            Keep it
          </Button>
        </div>
      </Dialog>
    </section>
  );
}
