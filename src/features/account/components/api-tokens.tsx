import { useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { EmptyState, ErrorState, InlineError, LoadingState } from "@/components/ui/states";
import { ApiError } from "@/lib/api-client";
import type { CreatedToken, TokenScope } from "@/lib/api-contract";
import { shortDateTime } from "@/lib/dates";
import type { Me } from "@/lib/api-contract";
import { useCreateApiToken } from "../api/create-api-token";
import { useApiTokens } from "../api/get-api-tokens";
import { useRevokeApiToken } from "../api/revoke-api-token";

const lifetimes = [
  { days: 7, label: "7 days" },
  { days: 30, label: "30 days" },
  { days: 90, label: "90 days" },
  { days: 366, label: "1 year" },
];

const scopeLabel: Record<TokenScope, string> = { read: "read", solve: "read + solve" };

// The secret exists in this one answer only: copy it now, the server keeps just its hash.
function NewSecret({ created, onDone }: { created: CreatedToken; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  return (
    <div role="status" className="rounded border border-verdigris/50 bg-verdigris/5 px-4 py-3 text-sm">
      <p className="font-medium">Token “{created.token.name}” created. Copy it now: it is shown only this once.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code aria-label="New token" className="select-all break-all rounded border border-rule bg-white px-2 py-1 font-mono text-xs">
          {created.secret}
        </code>
        <Button
          onClick={() => navigator.clipboard?.writeText(created.secret).then(() => setCopied(true), () => setCopied(false))}
        >
          {copied ? "Copied" : "Copy"}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Done
        </Button>
      </div>
      <p className="mt-2 text-xs text-ink/70">
        Send it as <code className="font-mono">Authorization: Bearer …</code>, or set <code className="font-mono">PORTFOLD_TOKEN</code> for{" "}
        <code className="font-mono">npm run -s solve -- FILE --server URL</code>.
      </p>
    </div>
  );
}

function CreateTokenForm({ me, onCreated }: { me: Me; onCreated: (created: CreatedToken) => void }) {
  const create = useCreateApiToken();
  const [name, setName] = useState("");
  const [scope, setScope] = useState<TokenScope>("read");
  const [teamId, setTeamId] = useState<string>("");
  const [days, setDays] = useState(90);
  const fields = create.error instanceof ApiError ? create.error.fields : undefined;
  return (
    <form
      aria-label="New API token"
      className="flex flex-wrap items-end gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        create.mutate(
          { name, scope, teamId: teamId === "" ? null : teamId, expiresInDays: days },
          {
            onSuccess: (created) => {
              setName("");
              onCreated(created);
            },
          },
        );
      }}
    >
      <TextField label="Name" required maxLength={100} value={name} onChange={(e) => setName(e.target.value)} placeholder="line-driver CI" error={fields?.name} className="w-56" />
      <SelectField label="Scope" value={scope} onChange={(e) => setScope(e.target.value as TokenScope)} className="w-36">
        <option value="read">read</option>
        <option value="solve">read + solve</option>
      </SelectField>
      <SelectField label="Teams" value={teamId} onChange={(e) => setTeamId(e.target.value)} error={fields?.teamId} className="w-56">
        <option value="">all my teams</option>
        {me.teams.map((team) => (
          <option key={team.id} value={team.id}>
            {team.name}
          </option>
        ))}
      </SelectField>
      <SelectField label="Expires after" value={days} onChange={(e) => setDays(Number(e.target.value))} className="w-32">
        {lifetimes.map((l) => (
          <option key={l.days} value={l.days}>
            {l.label}
          </option>
        ))}
      </SelectField>
      <Button type="submit" variant="primary" disabled={create.isPending}>
        {create.isPending ? "Creating…" : "Create token"}
      </Button>
      <div className="w-full">
        <InlineError error={fields ? null : create.error} />
      </div>
    </form>
  );
}

// Personal API tokens for scripts: the same roles as their owner, read or read + solve, one team or all.
export function ApiTokens({ me }: { me: Me }) {
  const tokens = useApiTokens();
  const revoke = useRevokeApiToken();
  const [created, setCreated] = useState<CreatedToken | null>(null);
  return (
    <div className="space-y-5">
      {created && <NewSecret created={created} onDone={() => setCreated(null)} />}
      <CreateTokenForm me={me} onCreated={setCreated} />
      {tokens.isLoading ? (
        <LoadingState label="Loading tokens…" />
      ) : tokens.isError ? (
        <ErrorState error={tokens.error} title="The tokens could not be loaded" />
      ) : tokens.data!.tokens.length === 0 ? (
        <EmptyState title="No tokens yet.">A token lets a notebook or a CI job read your networks and, with read + solve, store and solve them.</EmptyState>
      ) : (
        <table className="w-full text-sm">
          <caption className="sr-only">Your API tokens</caption>
          <thead>
            <tr className="border-b border-ink/30 text-left">
              <th scope="col" className="py-1 font-medium">Name</th>
              <th scope="col" className="py-1 font-medium">Scope</th>
              <th scope="col" className="py-1 font-medium">Teams</th>
              <th scope="col" className="py-1 font-medium">Expires</th>
              <th scope="col" className="py-1 font-medium">Last used</th>
              <th scope="col"><span className="sr-only">Revoke</span></th>
            </tr>
          </thead>
          <tbody>
            {tokens.data!.tokens.map((t) => (
              <tr key={t.id} className="border-b border-rule">
                <td className="py-1">
                  {t.name} <span className="font-mono text-xs text-ink/50">…{t.hint}</span>
                </td>
                <td className="py-1">{scopeLabel[t.scope]}</td>
                <td className="py-1">{t.team ? t.team.name : "all my teams"}</td>
                <td className={`py-1 ${t.expired ? "text-signal" : ""}`}>{t.expired ? `expired ${shortDateTime(t.expiresAt)}` : shortDateTime(t.expiresAt)}</td>
                <td className="py-1 text-ink/70">{t.lastUsedAt ? shortDateTime(t.lastUsedAt) : "never"}</td>
                <td className="py-1 text-right">
                  <button
                    type="button"
                    className="text-xs text-ink/60 hover:text-signal"
                    disabled={revoke.isPending}
                    onClick={() => {
                      if (window.confirm(`Revoke “${t.name}”? Scripts using it stop working at once.`)) revoke.mutate(t.id);
                    }}
                  >
                    Revoke
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <InlineError error={revoke.error} />
    </div>
  );
}
