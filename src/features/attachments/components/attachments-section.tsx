import { useId, useRef } from "react";
import { InlineError } from "@/components/ui/states";
import { useAttachments } from "../api/get-attachments";
import { useDeleteAttachment } from "../api/delete-attachment";
import { useUploadAttachment } from "../api/upload-attachment";

const TYPE_WORD: Record<string, string> = { "application/pdf": "PDF", "image/png": "PNG", "image/jpeg": "JPEG" };
const size = (bytes: number) => (bytes >= 1024 * 1024 ? `${(bytes / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`);

// Datasheets and scope captures kept with the network: everyone in the team reads them, editors add and remove.
export function AttachmentsSection({ networkId, canEdit }: { networkId: string; canEdit: boolean }) {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const list = useAttachments(networkId);
  const upload = useUploadAttachment();
  const remove = useDeleteAttachment();
  const limits = list.data?.limits;
  const types = limits ? limits.types.map((t) => TYPE_WORD[t] ?? t).join(", ") : "PDF, PNG, JPEG";
  return (
    <section aria-labelledby="attachments-heading" className="print:hidden">
      <h2 id="attachments-heading" className="mb-1 text-sm font-semibold tracking-tight">
        Attachments
      </h2>
      {list.isError ? (
        <InlineError error={list.error} />
      ) : list.data && list.data.attachments.length > 0 ? (
        <ul className="space-y-1 text-xs" aria-label="Attached files">
          {list.data.attachments.map((a) => (
            <li key={a.id} className="flex min-w-0 items-center justify-between gap-2">
              <a href={`/api/networks/${networkId}/attachments/${a.id}`} className="min-w-0 truncate text-copper hover:underline" download={a.filename}>
                {a.filename}
              </a>
              <span className="shrink-0 text-ink/50">
                {TYPE_WORD[a.contentType] ?? a.contentType} · {size(a.size)}
                {canEdit && (
                  <button type="button" className="ml-2 text-ink/60 hover:text-signal" aria-label={`Delete ${a.filename}`} disabled={remove.isPending} onClick={() => remove.mutate({ networkId, attachmentId: a.id })}>
                    Delete
                  </button>
                )}
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-xs text-ink/60">{list.isLoading ? "Loading…" : "No files attached."}</p>
      )}
      {canEdit && (
        <div className="mt-2">
          <label htmlFor={inputId} className="text-xs font-medium">
            Attach a file
          </label>
          <input
            id={inputId}
            ref={input}
            type="file"
            accept={(limits?.types ?? ["application/pdf", "image/png", "image/jpeg"]).join(",")}
            className="mt-0.5 block w-full text-xs"
            onChange={(event) => {
              const file = event.target.files?.[0];
              if (!file) return;
              upload.mutate({ networkId, file }, { onSettled: () => input.current && (input.current.value = "") });
            }}
          />
          <p className="mt-0.5 text-[11px] text-ink/60">
            {types}, up to {limits ? size(limits.maxBytes) : "the server's limit"}.{upload.isPending ? " Uploading…" : ""}
          </p>
          <InlineError error={upload.error ?? remove.error} />
        </div>
      )}
    </section>
  );
}
