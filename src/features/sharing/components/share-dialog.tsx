import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { InlineError, Progress } from "@/components/ui/states";
import { useTeamMembers } from "@/features/teams";
import type { CreatedShare, Share } from "@/lib/api-contract";
import { useCreateShareLink } from "../api/create-share-link";
import { useShareLinks } from "../api/get-share-links";
import { useRevokeShareLink } from "../api/revoke-share-link";

const ROLE_RIGHTS = [
  ["owner", "everything, members and deletion"],
  ["editor", "change networks, solve, share"],
  ["reviewer", "read, note on steps, give a verdict"],
  ["viewer", "read"],
] as const;

function CopyButton({ text }: { text: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <Button
      className="px-2 py-1 text-xs"
      onClick={async () => {
        await navigator.clipboard?.writeText(text).catch(() => undefined);
        setCopied(true);
        setTimeout(() => setCopied(false), 1500);
      }}
    >
      {copied ? "Copied" : "Copy"}
    </Button>
  );
}

// A link as listed, with its address when this dialog made it (the list never carries the address); a link just
// made shows before the list is read again.
type LinkEntry = { id: string; listed: Share | null; made: CreatedShare | null };

function LinkRow({ entry, networkId, number }: { entry: LinkEntry; networkId: string; number: number }) {
  const revoke = useRevokeShareLink();
  const { listed, made } = entry;
  const url = made?.url ?? null;
  const expiresAt = listed?.expiresAt ?? made?.expiresAt ?? null;
  const createdAt = listed?.createdAt ?? made?.createdAt ?? "";
  const live = (listed ? listed.status === "active" && !listed.revokedAt : true) && !revoke.isSuccess;
  const state = !live
    ? listed?.revokedAt || revoke.isSuccess
      ? "Revoked: no longer opens."
      : "Expired: no longer opens."
    : expiresAt
      ? `Opens until ${new Date(expiresAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}.`
      : "Opens until revoked.";
  return (
    <li className="rounded border border-rule bg-white/60 p-2">
      <div className="flex items-center gap-2">
        {url ? (
          <input aria-label="Share link address" readOnly value={url} className="min-w-0 flex-1 bg-transparent font-mono text-xs" onFocus={(e) => e.target.select()} data-testid="share-url" />
        ) : (
          <span className="min-w-0 flex-1 text-xs text-ink/70">
            Link made {createdAt ? new Date(createdAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" }) : ""}
            {listed?.createdBy ? ` by ${listed.createdBy.name}` : ""} (its address was shown once, when it was made)
          </span>
        )}
        {live && url && <CopyButton text={url} />}
        {live && (
          <Button
            variant="quiet"
            className="px-2 py-1 text-xs hover:text-signal"
            disabled={revoke.isPending}
            onClick={() => {
              if (window.confirm("Revoke this share link? Anyone holding it loses access at once.")) revoke.mutate({ networkId, number, shareId: entry.id });
            }}
          >
            Revoke
          </Button>
        )}
      </div>
      <p className="mt-1 text-[11px] text-ink/60">{state}</p>
      <InlineError error={revoke.error} />
    </li>
  );
}

// Share links for one revision, and who can see what.
export function ShareDialog({ open, onClose, networkId, teamId, number }: { open: boolean; onClose: () => void; networkId: string; teamId: string; number: number }) {
  const expiryId = useId();
  const [expiry, setExpiry] = useState("");
  const links = useShareLinks(networkId, number, open);
  const create = useCreateShareLink();
  const members = useTeamMembers(open ? teamId : undefined);
  // The address of a link is known only in the answer that made it; keep it for this dialog.
  const [created, setCreated] = useState<CreatedShare[]>([]);
  const all: LinkEntry[] = [...(links.data ?? [])].reverse().map((listed) => ({ id: listed.id, listed, made: created.find((c) => c.id === listed.id) ?? null }));
  for (const made of created) if (!all.some((entry) => entry.id === made.id)) all.unshift({ id: made.id, listed: null, made });

  return (
    <Dialog open={open} onClose={onClose} title={`Share revision ${number}`} wide>
      <p className="text-sm text-ink/80">
        A share link opens revision {number} read-only, without an account: the ledger, Values, Limits and Sweep. It cannot change anything or
        add notes. Each link is its own unguessable address and can be revoked.
      </p>
      <form
        className="mt-3 flex flex-wrap items-end gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          create.mutate(
            { networkId, number, expiresAt: expiry ? new Date(`${expiry}T23:59:59`).toISOString() : undefined },
            {
              onSuccess: (link) => setCreated((list) => [link, ...list]),
            },
          );
        }}
      >
        <div>
          <label htmlFor={expiryId} className="block text-xs font-medium">
            Expires after (optional)
          </label>
          <input id={expiryId} type="date" value={expiry} onChange={(e) => setExpiry(e.target.value)} className="mt-0.5 rounded border border-rule bg-white px-2 py-1 text-xs" />
        </div>
        <Button type="submit" variant="primary" disabled={create.isPending}>
          {create.isPending ? "Creating…" : "Create share link"}
        </Button>
      </form>
      <InlineError error={create.error} />
      <div className="mt-3">
        {links.isLoading && <Progress label="Loading share links…" />}
        {links.isError && <InlineError error={links.error} />}
        {all.length > 0 ? (
          <ul className="space-y-2" aria-label="Share links of this revision">
            {all.map((entry) => (
              <LinkRow key={entry.id} entry={entry} networkId={networkId} number={number} />
            ))}
          </ul>
        ) : (
          !links.isLoading && <p className="text-xs text-ink/60">No share links for this revision yet.</p>
        )}
      </div>
      <section className="mt-4 border-t border-rule pt-3" aria-labelledby={`${expiryId}-who`}>
        <h3 id={`${expiryId}-who`} className="text-sm font-semibold">
          Who can see what
        </h3>
        <ul className="mt-1 text-xs text-ink/80">
          <li>Anyone with an open share link: revision {number}, read-only.</li>
          {ROLE_RIGHTS.map(([role, rights]) => (
            <li key={role}>
              Team {role}s: {rights}.
            </li>
          ))}
        </ul>
        {members.data && members.data.length > 0 && (
          <table className="mt-2 w-full text-xs">
            <caption className="sr-only">Team members</caption>
            <thead>
              <tr className="text-left text-ink/60">
                <th scope="col" className="font-medium">Member</th>
                <th scope="col" className="font-medium">Role</th>
              </tr>
            </thead>
            <tbody>
              {members.data.map((m) => (
                <tr key={m.userId} className="border-t border-rule/60">
                  <td className="py-0.5">
                    {m.name} <span className="text-ink/50">{m.email}</span>
                  </td>
                  <td className="py-0.5">{m.role}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </Dialog>
  );
}
