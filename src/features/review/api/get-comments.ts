import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Comment } from "@/types/api";

type Loose = Record<string, unknown>;

function stamp(raw: unknown): Comment["resolved"] {
  if (!raw || typeof raw !== "object") return null;
  const { by, at } = raw as { by?: { name?: string } | null; at?: string };
  return { by: by?.name ?? null, at: String(at ?? "") };
}

function flatten(list: Loose[], parentId: string | null, out: Comment[]) {
  for (const raw of list) {
    const author = raw.author as { id?: string; name?: string } | null;
    const comment: Comment = {
      id: String(raw.id),
      stepId: String(raw.stepId ?? ""),
      parentId: (raw.parentId as string | null) ?? parentId,
      body: String(raw.body ?? ""),
      deleted: Boolean(raw.deleted),
      author: author?.name ?? null,
      authorId: author?.id ?? null,
      createdAt: String(raw.createdAt ?? ""),
      updatedAt: String(raw.updatedAt ?? raw.createdAt ?? ""),
      anchor: (raw.anchor as Comment["anchor"]) ?? null,
      resolved: stamp(raw.resolved),
      reopened: stamp(raw.reopened),
    };
    out.push(comment);
    flatten((raw.replies as Loose[] | undefined) ?? [], comment.id, out);
  }
  return out;
}

// Review notes of one revision, threaded on the server, flat here (replies keep their parentId).
export async function getComments(networkId: string, k: number): Promise<Comment[]> {
  const body = await api<{ comments: Loose[] }>(`/networks/${encodeURIComponent(networkId)}/revisions/${k}/comments`);
  return flatten(body.comments ?? [], null, []);
}

export const commentsQueryOptions = (networkId: string, k: number) =>
  queryOptions({ queryKey: ["networks", networkId, "revisions", k, "comments"], queryFn: () => getComments(networkId, k) });

export function useComments(networkId: string, k: number, enabled = true) {
  return useQuery({ ...commentsQueryOptions(networkId, k), enabled: enabled && Boolean(networkId) && k > 0 });
}
