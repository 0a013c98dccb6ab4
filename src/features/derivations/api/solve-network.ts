import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api, ApiError } from "@/lib/api-client";
import type { Diagnostic, Revision, SolveJob, SolveJobAnswer } from "@/lib/api-contract";
import { getRevision } from "./get-revision";

export type SolveProgress = "sending" | "queued" | "solving" | "done";

// A failed job's error is the one error shape's inner object, with the status it would have answered.
type JobError = { code?: string; message?: string; status?: number; diagnostics?: Diagnostic[] };

const POLL_MS = 700;

// A long solve leaves the request path: the server answers 202 with a job, polled until it ends.
async function followJob(networkId: string, job: SolveJob, onProgress: (p: SolveProgress) => void) {
  let current = job;
  for (;;) {
    onProgress(current.status === "done" ? "done" : current.status === "failed" ? "done" : current.status);
    if (current.status === "done" && current.revision) return getRevision(networkId, current.revision.number);
    if (current.status === "failed") {
      const e: JobError = current.error ?? {};
      throw new ApiError(e.status ?? 422, e.code ?? "solve_failed", e.message ?? "The solve did not finish.", undefined, e.diagnostics);
    }
    await new Promise((resolve) => setTimeout(resolve, POLL_MS));
    current = await api<SolveJob>(current.poll.replace(/^\/api/, ""));
  }
}

// Each solve stores a new, immutable derivation revision with its steps.
async function solveNetwork({ networkId, onProgress = () => undefined }: { networkId: string; onProgress?: (p: SolveProgress) => void }) {
  onProgress("sending");
  // 201 with the revision, or 202 with a job to poll.
  const body = await api<Revision | SolveJobAnswer>(`/networks/${encodeURIComponent(networkId)}/solve`, { method: "POST", json: {} });
  if ("job" in body) return followJob(networkId, body.job, onProgress);
  onProgress("done");
  return body;
}

export function useSolveNetwork() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: solveNetwork,
    onSuccess: (revision, { networkId }) => {
      queryClient.setQueryData(["networks", networkId, "revisions", revision.number], revision);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: ["networks", networkId], exact: true }),
        queryClient.invalidateQueries({ queryKey: ["networks", networkId, "revisions", "list"] }),
      ]);
    },
  });
}
