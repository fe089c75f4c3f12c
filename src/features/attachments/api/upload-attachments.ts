import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiErrorSchema } from '@shared/api/api-error.schema';
import { csrfResponseSchema } from '@shared/auth/auth.schema';
import {
  MAX_ATTACHMENT_BYTES,
  MAX_ATTACHMENTS_PER_REQUEST,
  type Attachment,
  type AttachmentTarget,
} from '@shared/files/attachment.schema';
import { api, ApiError, CSRF_HEADER, CSRF_PATH } from '@/lib/api-client';
import { attachmentKeys, attachmentsUrl } from './attachment-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

const MAX_MB = MAX_ATTACHMENT_BYTES / (1024 * 1024);

/** Said when a proxy refuses before our server does (no error envelope to read). */
export const TOO_LARGE_MESSAGE = `Too big: each file may be up to ${MAX_MB} MB, and up to ${MAX_ATTACHMENTS_PER_REQUEST} files go at once.`;
export const WRONG_TYPE_MESSAGE = 'Only photos (JPEG, PNG, WebP or HEIC) and PDF files can be added.';
/** Uploads are not queued like runs are: a photo is too big to keep waiting on the phone. */
export const NEEDS_CONNECTION_MESSAGE =
  'Adding photos needs a connection. They are not kept for later, so choose them again when you have signal.';

export interface UploadAnswer {
  items: Attachment[];
  count: number;
}

/** What is wrong with a choice before anything is sent (saves a long upload the server would refuse), or null. */
export function checkChosenFiles(files: readonly File[]): string | null {
  if (files.length > MAX_ATTACHMENTS_PER_REQUEST) {
    return `You chose ${files.length} files; up to ${MAX_ATTACHMENTS_PER_REQUEST} can go at once.`;
  }
  const big = files.find((f) => f.size > MAX_ATTACHMENT_BYTES);
  return big ? `“${big.name}” is over ${MAX_MB} MB; each file may be up to ${MAX_MB} MB.` : null;
}

/** The files alone: the record they go on travels in the query string (attachmentsUrl). */
export function attachmentFormData(files: readonly File[]): FormData {
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  return form;
}

async function readJson(response: Response): Promise<unknown> {
  try {
    return (await response.json()) as unknown;
  } catch {
    return undefined;
  }
}

async function refusal(response: Response): Promise<ApiError> {
  const envelope = apiErrorSchema.safeParse(await readJson(response));
  if (envelope.success) {
    const { code, message, fieldErrors, requestId } = envelope.data.error;
    return new ApiError({ status: response.status, code, message, fieldErrors, requestId });
  }
  const { status } = response;
  if (status === 413) return new ApiError({ status, code: 'payload_too_large', message: TOO_LARGE_MESSAGE });
  if (status === 415) return new ApiError({ status, code: 'unsupported_media_type', message: WRONG_TYPE_MESSAGE });
  return new ApiError({
    status,
    code: status >= 500 ? 'unavailable' : 'unexpected_response',
    message: `The files were not added (error ${status}). Try again shortly.`,
  });
}

async function post(target: AttachmentTarget, form: FormData): Promise<Response> {
  // The token the session already has (the server hands out the same one); the api client keeps JSON only.
  const { token } = await api.get(CSRF_PATH, { schema: csrfResponseSchema });
  try {
    // No Content-Type: the browser writes the multipart boundary itself.
    return await fetch(attachmentsUrl(target), {
      method: 'POST',
      headers: { Accept: 'application/json', [CSRF_HEADER]: token },
      body: form,
      credentials: 'same-origin',
    });
  } catch (error) {
    throw new ApiError({ status: 0, code: 'network', message: NEEDS_CONNECTION_MESSAGE, cause: error });
  }
}

/** Sends the files in one multipart request; every failure arrives as an ApiError with a message to show. */
export async function uploadAttachments(target: AttachmentTarget, files: readonly File[]): Promise<UploadAnswer> {
  const problem = checkChosenFiles(files);
  if (problem) throw new ApiError({ status: 0, code: 'payload_too_large', message: problem });
  const form = attachmentFormData(files);
  let response: Response;
  try {
    response = await post(target, form);
  } catch (error) {
    // The token request found no connection either.
    if (error instanceof ApiError && error.code === 'network') {
      throw new ApiError({ status: 0, code: 'network', message: NEEDS_CONNECTION_MESSAGE, cause: error });
    }
    throw error;
  }
  if (response.status === 403) {
    const error = await refusal(response.clone());
    // The session changed since the token was read: once more with a fresh one.
    if (error.code === 'csrf_invalid') response = await post(target, form);
  }
  if (!response.ok) throw await refusal(response);
  return (await response.json()) as UploadAnswer;
}

/** An online write, never queued: its errors are shown beside the button, and the list refreshes after. */
export function useUploadAttachments(target: AttachmentTarget) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (files: readonly File[]) => uploadAttachments(target, files),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: attachmentKeys.list(target) }),
  });
}
