import type { ReactNode } from "react";
import { ApiError } from "@/lib/api-client";

// A thin bar that moves: the only motion Portfold allows is progress.
export function Progress({ label }: { label: string }) {
  return (
    <div role="status" aria-live="polite" className="text-sm text-ink/70">
      <span>{label}</span>
      <span className="mt-1.5 block h-0.5 w-40 overflow-hidden rounded bg-rule">
        <span className="block h-full w-1/3 animate-[progress_1.1s_ease-in-out_infinite] bg-copper" />
      </span>
    </div>
  );
}

export function LoadingState({ label = "Loading…" }: { label?: string }) {
  return (
    <div className="py-8">
      <Progress label={label} />
    </div>
  );
}

export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error) return error.message;
  return "Something went wrong.";
}

export function ErrorState({ error, title = "This could not be loaded", children }: { error: unknown; title?: string; children?: ReactNode }) {
  return (
    <div role="alert" className="rounded border border-signal/40 bg-signal/5 px-4 py-3 text-sm">
      <p className="font-medium text-signal">{title}</p>
      <p className="mt-1 text-ink/80">{errorMessage(error)}</p>
      {children}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded border border-dashed border-rule px-4 py-6 text-sm">
      <p className="font-medium">{title}</p>
      {children && <div className="mt-1 text-ink/70">{children}</div>}
    </div>
  );
}

export function InlineError({ error }: { error: unknown }) {
  if (!error) return null;
  return (
    <p role="alert" className="text-sm text-signal">
      {errorMessage(error)}
    </p>
  );
}
