import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/api-client";
import type { Diagnostic } from "@/types/api";
import { getRevision } from "./get-revision";
import { normaliseRevision } from "./normalise-revision";

export type SolveProgress = "sending" | "queued" | "solving" | "done";

interface SolveJob {
  status: "queued" | "solving" | "done" | "failed";
  revision: { number: number } | null;
  error: { code?: string; message?: string; status?: number; diagnostics?: Diagnostic[] } | null;
  poll: string;
}

const POLL_MS = 700;

// A long solve leaves the request path: the server answers 202 with a job, polled until it ends.
async function followJob(networkId: string, job: SolveJob, onProgress: (p: SolveProgress) => void) {
  let current = job;
  for (;;) {
    onProgress(current.status === "done" ? "done" : current.status === "failed" ? "done" : current.status);
    if (current.status === "done" && current.revision) return getRevision(networkId, current.revision.number);
    if (current.status === "failed") {
      const e = current.error ?? {};
      throw new ApiError(e.status ?? 422, e.code ?? "solve_failed", e.message ?? "The solve did not finish.", undefined, e.diagnostics);
    }
    await new Promise((resolve) => setTimeout(resolve, POLL_MS));
    current = (await api<SolveJob | { job: SolveJob }>(current.poll.replace(/^\/api/, "")).then((body) => ("job" in body ? body.job : body))) as SolveJob;
  }
}

// Each solve stores a new, immutable derivation revision with its steps.
export async function solveNetwork({ networkId, onProgress = () => undefined }: { networkId: string; onProgress?: (p: SolveProgress) => void }) {
  onProgress("sending");
  const body = await api<Record<string, unknown>>(`/networks/${encodeURIComponent(networkId)}/solve`, { method: "POST", json: {} });
  if (body && typeof body === "object" && "job" in body && !("steps" in body)) return followJob(networkId, body.job as SolveJob, onProgress);
  onProgress("done");
  return normaliseRevision(body);
}

export function useSolveNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: solveNetwork,
    onSuccess: (revision, { networkId }) => {
      queryClient.setQueryData(["networks", networkId, "revisions", revision.k], revision);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: ["networks", networkId], exact: true }),
        queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", "list"] }),
      ]);
    },
  });
}
