import { useState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { InlineError } from "@/components/ui/states";

// The network's title and description, edited in place by editors.
export function NetworkHeading({
  title,
  description,
  canEdit,
  onSave,
  children,
}: {
  title: string;
  description: string;
  canEdit: boolean;
  onSave: (patch: { title: string; description: string }) => Promise<unknown>;
  /** The metadata line under the title. */
  children?: ReactNode;
}) {
  const [editing, setEditing] = useState<{ title: string; description: string } | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [saving, setSaving] = useState(false);
  if (editing) {
    return (
      <form
        className="w-full space-y-2"
        aria-label="Title and description"
        onSubmit={(event) => {
          event.preventDefault();
          if (!editing.title.trim()) return;
          setSaving(true);
          onSave({ title: editing.title.trim(), description: editing.description }).then(
            () => {
              setEditing(null);
              setError(null);
              setSaving(false);
            },
            (e: unknown) => {
              setError(e);
              setSaving(false);
            },
          );
        }}
      >
        <label className="block text-xs font-medium">
          Title
          <input value={editing.title} maxLength={200} required onChange={(e) => setEditing({ ...editing, title: e.target.value })} className="mt-0.5 block w-full rounded border border-rule bg-white px-2 py-1 text-lg font-semibold focus:border-copper focus:outline-none" />
        </label>
        <label className="block text-xs font-medium">
          Description
          <textarea value={editing.description} maxLength={5000} rows={2} onChange={(e) => setEditing({ ...editing, description: e.target.value })} className="mt-0.5 block w-full rounded border border-rule bg-white px-2 py-1 text-sm focus:border-copper focus:outline-none" />
        </label>
        <InlineError error={error} />
        <div className="flex gap-2">
          <Button type="submit" variant="primary" disabled={saving || !editing.title.trim()}>
            {saving ? "Saving…" : "Save title and description"}
          </Button>
          <Button onClick={() => setEditing(null)}>Cancel</Button>
        </div>
      </form>
    );
  }
  return (
    <div className="min-w-0">
      <div className="flex flex-wrap items-baseline gap-x-3">
        <h1 className="break-words text-2xl font-semibold tracking-tight">{title}</h1>
        {canEdit && (
          <button type="button" className="text-xs text-copper hover:underline print:hidden" onClick={() => setEditing({ title, description })}>
            Edit title and description
          </button>
        )}
      </div>
      {description && <p className="mt-0.5 max-w-3xl whitespace-pre-line text-sm text-ink/80">{description}</p>}
      {children}
    </div>
  );
}
