// The command line's server mode: store the network in a team, solve it there, and return the revision's permanent link.
import { basename } from "node:path";
import type { CurrentToken } from "../shared/api/tokens.js";

export interface ServerTarget {
  url: string;
  token: string;
  // A team id or a team's exact name; null: the token's own team, else the person's personal team.
  team: string | null;
}

export interface Stored {
  link: string;
  stored: { teamId: string; networkId: string; revision: number };
}

export class ServerError extends Error {}

async function call<T>(target: ServerTarget, method: string, path: string, body?: FormData): Promise<{ status: number; body: T }> {
  let response: Response;
  try {
    response = await fetch(new URL(path, target.url), { method, headers: { Authorization: `Bearer ${target.token}` }, body });
  } catch (error) {
    throw new ServerError(`cannot reach ${target.url}: ${error instanceof Error ? error.message : String(error)}`);
  }
  const text = await response.text();
  let parsed: unknown = null;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    throw new ServerError(`${method} ${path}: the server answered ${response.status} without JSON; is ${target.url} a Portfold server?`);
  }
  const error = (parsed as { error?: { code?: string; message?: string } } | null)?.error;
  if (response.status >= 400) throw new ServerError(`${method} ${path}: ${response.status} ${error?.code ?? ""}: ${error?.message ?? text}`.trim());
  return { status: response.status, body: parsed as T };
}

function chooseTeam(target: ServerTarget, current: CurrentToken): string {
  if (target.team !== null) {
    const given = target.team;
    const team = current.teams.find((t) => t.id === given.toLowerCase()) ?? current.teams.find((t) => t.name === given);
    if (!team) throw new ServerError(`--team ${given}: the token reaches no such team (it reaches: ${current.teams.map((t) => `${t.name} ${t.id}`).join("; ") || "none"})`);
    return team.id;
  }
  if (current.token.team) return current.token.team.id;
  const personal = current.teams.find((t) => t.personal);
  if (!personal) throw new ServerError("give --team: the token reaches every team and the person has no personal team");
  return personal.id;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

interface SolveAnswer {
  number?: number;
  permalink?: string;
  job?: { poll: string };
}
interface JobAnswer {
  status: string;
  revision: { number: number; permalink: string } | null;
  error: { code?: string; message?: string } | null;
}

export async function storeOnServer(target: ServerTarget, file: string, text: string): Promise<Stored> {
  if (!target.token) throw new ServerError("--server needs an API token in PORTFOLD_TOKEN (create one on your account page)");
  const current = (await call<CurrentToken>(target, "GET", "/api/account/tokens/current")).body;
  const teamId = chooseTeam(target, current);
  const form = new FormData();
  form.append("file", new Blob([text], { type: "text/plain" }), basename(file));
  const network = (await call<{ id: string }>(target, "POST", `/api/teams/${teamId}/networks/import`, form)).body;
  const solved = (await call<SolveAnswer>(target, "POST", `/api/networks/${network.id}/solve`)).body;
  let revision = solved.number !== undefined && solved.permalink ? { number: solved.number, permalink: solved.permalink } : null;
  // A long solve answers 202 with a job; poll it until it ends.
  for (let wait = 250; revision === null; wait = Math.min(wait * 2, 4_000)) {
    if (!solved.job) throw new ServerError("the server's solve answer has neither a revision nor a job");
    await sleep(wait);
    const job = (await call<JobAnswer>(target, "GET", solved.job.poll)).body;
    if (job.status === "failed") throw new ServerError(`the server could not solve it: ${job.error?.code ?? ""}: ${job.error?.message ?? ""}`);
    if (job.status === "done") revision = job.revision;
  }
  return { link: new URL(revision.permalink, target.url).toString(), stored: { teamId, networkId: network.id, revision: revision.number } };
}
