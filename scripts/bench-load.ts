// Load benchmark of the server on loopback (autocannon). A script, not a test: it prints figures
// beside their targets and beside a reference measured in the same run; it asserts nothing.
//
//   npm run bench:load                       starts `server/index.ts` on a free port against DATABASE_URL
//                                            (default: the local cluster's `portfold`, as `npm start` leaves it)
//   BENCH_URL=http://127.0.0.1:4317 npm run bench:load      uses a server that is already running
//
// Needs the seeded demo (the demo login and its share link): run `npm start` once first.
//   1. A shared revision (GET /api/share/<demo token>), 100 connections for 20 s; target p99 ≤ 50 ms,
//      0 errors. Reference: GET /api/health at the same load.
//   2. GET /api/health, 10 connections for 10 s, while heavy solves keep every solver thread busy;
//      target p99 ≤ 20 ms. Reference: the same health load with no solve running.
//   3. Hostile mix: one account floods solves (40 at once, again and again) while 8 connections read
//      the largest revision the bounds allow (a wide symbolic chain, trimmed to REVISION_MAX_BYTES);
//      health p99 beside the quiet reference of 2; target ≤ 3 × the reference.
//   4. Scaling out: 2 web processes (SOLVE_WORKER=false) and 2 worker processes (`npm run worker`, one
//      solver thread each) on the same database take 24 heavy solves sent to both web processes;
//      solves per second and the oldest wait in the queue, beside the same solves on the one server
//      of 1.–3. (its own threads) in the same run. Skipped with BENCH_URL.
// BENCH_SECONDS scales both durations (default 20 for the first, half that for the second).
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";
import autocannon from "autocannon";
import { config } from "../server/config.js";
import { demoShareToken, demoUser } from "../server/db/demo-data.js";

const root = fileURLToPath(new URL("..", import.meta.url));
const seconds = Number(process.env.BENCH_SECONDS ?? 20);

interface Figures {
  p50: number;
  p99: number;
  requests: number;
  rps: number;
  errors: number;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once("error", reject);
    probe.listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

async function startServer(env: Record<string, string> = {}): Promise<{ url: string; child: ChildProcess }> {
  const [port, mailPort] = [await freePort(), await freePort()];
  const url = `http://127.0.0.1:${port}`;
  const child = spawn(`${root}node_modules/.bin/tsx`, ["server/index.ts"], {
    cwd: root,
    env: { ...process.env, PORT: String(port), MAIL_CAPTURE_PORT: String(mailPort), PUBLIC_URL: url, NODE_ENV: process.env.NODE_ENV ?? "development", ...env },
    stdio: ["ignore", "ignore", "inherit"],
  });
  for (let attempt = 0; attempt < 150; attempt++) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}; is PostgreSQL running (npm start)?`);
    const up = await fetch(`${url}/api/health`).then((response) => response.ok, () => false);
    if (up) return { url, child };
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  child.kill();
  throw new Error("the server did not answer /api/health within 30 s");
}

async function load(url: string, connections: number, duration: number, headers: Record<string, string> = {}): Promise<Figures> {
  const result = await autocannon({ url, connections, duration, headers });
  return {
    p50: result.latency.p50,
    p99: result.latency.p99,
    requests: result.requests.total,
    rps: result.requests.average,
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

const line = (label: string, figures: Figures, target?: string) =>
  `  ${label.padEnd(44)} p50 ${String(figures.p50).padStart(4)} ms  p99 ${String(figures.p99).padStart(4)} ms  ${String(Math.round(figures.rps)).padStart(6)} req/s  errors ${figures.errors}${target ? `   target ${target}` : ""}`;

// A mesh with every pair of eight nodes joined by its own symbolic resistance: about a second of
// exact algebra per solve here, and a result (tens of thousands of terms) that the default
// SOLVE_MAX_RESULT_TERMS then refuses, so nothing large is stored. A fresh tag per solve keeps the
// cache from answering it.
function heavyCircuit(tag: string) {
  const nodes = ["0", "k1", "k2", "k3", "k4", "k5", "k6", "k7"];
  const elements: Record<string, unknown>[] = [{ name: "Drive", kind: "voltage", nodes: ["k1", "0"], value: "Vd" }];
  let count = 0;
  for (let i = 0; i < nodes.length; i++) {
    for (let j = i + 1; j < nodes.length; j++) elements.push({ name: `leg_${i}_${j}`, kind: "resistor", nodes: [nodes[i], nodes[j]], value: `g${++count}_${tag}` });
  }
  return { ground: "0", port: { plus: nodes[nodes.length - 1], minus: "0" }, elements };
}

interface Batch {
  asked: number;
  solved: number;
  seconds: number;
  oldestWaitMs: number;
}

// `count` heavy solves sent at once, round robin over `urls` (one session works on every process),
// each followed to its end; the queue wait is a job's startedAt − createdAt.
async function solveBatch(urls: string[], cookie: string, teamId: string, count: number): Promise<Batch> {
  const started = Date.now();
  let solved = 0;
  let oldestWaitMs = 0;
  await Promise.all(
    Array.from({ length: count }, async (_, i) => {
      const url = urls[i % urls.length];
      const headers = { Origin: url, "Content-Type": "application/json", Cookie: cookie };
      const tag = randomBytes(3).toString("hex");
      const created = await fetch(`${url}/api/teams/${teamId}/networks`, { method: "POST", headers, body: JSON.stringify({ title: `Spread ${tag}`, circuit: heavyCircuit(tag) }) });
      const { id } = (await created.json()) as { id: string };
      type Job = { status: string; poll: string; createdAt: string; startedAt: string | null };
      let job: Job | undefined;
      // At the person's solve limit (429), ask again a little later, as a script would.
      for (const deadline = Date.now() + 15 * 60_000; Date.now() < deadline && !job; ) {
        const answer = await fetch(`${url}/api/networks/${id}/solve?wait=0`, { method: "POST", headers });
        if (answer.status === 429) await new Promise((resolve) => setTimeout(resolve, 250));
        else job = ((await answer.json()) as { job?: Job }).job;
        if (answer.status !== 429 && !job) break;
      }
      while (job && job.status !== "done" && job.status !== "failed") {
        await new Promise((resolve) => setTimeout(resolve, 200));
        job = (await (await fetch(`${url}${job.poll}`, { headers: { Cookie: cookie } })).json()) as Job;
      }
      if (!job) return;
      solved += 1;
      if (job.startedAt) oldestWaitMs = Math.max(oldestWaitMs, Date.parse(job.startedAt) - Date.parse(job.createdAt));
    }),
  );
  return { asked: count, solved, seconds: (Date.now() - started) / 1000, oldestWaitMs };
}

async function main() {
  const given = process.env.BENCH_URL?.replace(/\/+$/, "");
  const server = given ? { url: given, child: null } : await startServer();
  const { url } = server;
  console.log(`[bench:load] server ${url}${given ? " (given)" : " (started for this run)"}; ${seconds} s runs`);
  const origin = { Origin: url, "Content-Type": "application/json" };
  let cookie = "";
  let benchTeam: string | null = null;
  try {
    const login = await fetch(`${url}/api/auth/login`, { method: "POST", headers: origin, body: JSON.stringify({ email: demoUser.email, password: config.demoPassword }) });
    if (!login.ok) throw new Error(`demo sign-in answered ${login.status}: seed the demo first (npm start)`);
    cookie = login.headers.getSetCookie().map((entry) => entry.split(";")[0]).join("; ");
    const shared = `${url}/api/share/${demoShareToken}`;
    if ((await fetch(shared)).status !== 200) throw new Error("the demo share link does not resolve: seed the demo first (npm start)");

    console.log("\n1. reading a shared revision, 100 connections");
    await load(shared, 100, 2);
    const health100 = await load(`${url}/api/health`, 100, Math.max(2, Math.round(seconds / 2)));
    const sharedFigures = await load(shared, 100, seconds);
    console.log(line("GET /api/health (reference)", health100));
    console.log(line("GET /api/share/:token", sharedFigures, "p99 ≤ 50 ms, 0 errors"));
    console.log(`  → ${sharedFigures.p99 <= 50 && sharedFigures.errors === 0 ? "within target" : "OUTSIDE target"} (${sharedFigures.requests} requests)`);

    console.log("\n2. health while heavy solves run, 10 connections");
    const healthSeconds = Math.max(2, Math.round(seconds / 2));
    const idle = await load(`${url}/api/health`, 10, healthSeconds);
    const team = await fetch(`${url}/api/teams`, { method: "POST", headers: { ...origin, Cookie: cookie }, body: JSON.stringify({ name: `Load bench ${new Date().toISOString()}` }) });
    benchTeam = ((await team.json()) as { id: string }).id;
    let solving = true;
    let solved = 0;
    const solveLoop = async () => {
      while (solving) {
        const tag = randomBytes(3).toString("hex");
        const created = await fetch(`${url}/api/teams/${benchTeam}/networks`, { method: "POST", headers: { ...origin, Cookie: cookie }, body: JSON.stringify({ title: `Heavy mesh ${tag}`, circuit: heavyCircuit(tag) }) });
        const { id } = (await created.json()) as { id: string };
        const answer = await fetch(`${url}/api/networks/${id}/solve`, { method: "POST", headers: { ...origin, Cookie: cookie } });
        // A solve longer than the server's wait comes back as a job: follow it to its end, as the client does.
        let status = answer.status === 202 ? ((await answer.json()) as { job: { status: string; poll: string } }).job : null;
        while (status && status.status !== "done" && status.status !== "failed") {
          await new Promise((resolve) => setTimeout(resolve, 250));
          status = (await (await fetch(`${url}${status.poll}`, { headers: { Cookie: cookie } })).json()) as { status: string; poll: string };
        }
        // Answered after a full run on a thread: stored (201, done) or refused for its result size (422).
        if (answer.status === 201 || answer.status === 422 || status?.status === "done" || status?.status === "failed") solved += 1;
      }
    };
    // One more solve loop than the server has threads, so a solve is always waiting for a thread.
    const loops = Array.from({ length: config.solve.threads + 1 }, solveLoop);
    await new Promise((resolve) => setTimeout(resolve, 1_000));
    const busy = await load(`${url}/api/health`, 10, healthSeconds);
    solving = false;
    await Promise.all(loops);
    console.log(line("GET /api/health, no solve running (reference)", idle));
    console.log(line(`GET /api/health, ${loops.length} solve loops`, busy, "p99 ≤ 20 ms"));
    console.log(`  → ${busy.p99 <= 20 ? "within target" : "OUTSIDE target"}; ${solved} heavy solves ran meanwhile`);

    console.log("\n3. hostile mix: one account flooding solves, 8 readers of the largest revision");
    const post = (path: string, body?: unknown) => fetch(`${url}${path}`, { method: "POST", headers: { ...origin, Cookie: cookie }, body: body === undefined ? undefined : JSON.stringify(body) });
    // Forty links of two symbols each: its sensitivities alone are far past REVISION_MAX_BYTES, so the stored revision is as large as allowed.
    const wideTag = randomBytes(3).toString("hex");
    const wide = { ground: "0", port: { plus: "t40", minus: "0" }, elements: [{ name: "Source", kind: "voltage", nodes: ["t0", "0"], value: "Vs" }, ...Array.from({ length: 40 }, (_, i) => ({ name: `link${i + 1}`, kind: "resistor", nodes: [`t${i}`, `t${i + 1}`], value: `Ra${wideTag}${i} + Rb${wideTag}${i}` }))] };
    const wideId = ((await (await post(`/api/teams/${benchTeam}/networks`, { title: "Widest chain", circuit: wide })).json()) as { id: string }).id;
    const wideAnswer = await post(`/api/networks/${wideId}/solve?wait=60000`);
    const largest = `${url}/api/networks/${wideId}/revisions/1`;
    const largestBytes = wideAnswer.status === 201 ? (await wideAnswer.text()).length : 0;
    let flooding = true;
    const floodAnswers: Record<number, number> = {};
    const flood = async () => {
      while (flooding) {
        const tags = Array.from({ length: 40 }, () => randomBytes(3).toString("hex"));
        const ids = await Promise.all(tags.map(async (tag) => ((await (await post(`/api/teams/${benchTeam}/networks`, { title: `Flood ${tag}`, circuit: heavyCircuit(tag) })).json()) as { id: string }).id));
        const answers = await Promise.all(ids.map((id) => post(`/api/networks/${id}/solve?wait=0`)));
        for (const answer of answers) floodAnswers[answer.status] = (floodAnswers[answer.status] ?? 0) + 1;
        await new Promise((resolve) => setTimeout(resolve, 500));
      }
    };
    const flooder = flood();
    const readers = largestBytes > 0 ? load(largest, 8, healthSeconds, { Cookie: cookie }) : Promise.resolve(null);
    await new Promise((resolve) => setTimeout(resolve, 500));
    const hostile = await load(`${url}/api/health`, 10, healthSeconds);
    const read = await readers;
    flooding = false;
    await flooder;
    console.log(line("GET /api/health, quiet (reference, from 2.)", idle));
    console.log(line("GET /api/health, hostile mix", hostile, `p99 ≤ ${3 * idle.p99} ms (3 × reference)`));
    if (read) console.log(line(`GET the largest revision (${Math.round(largestBytes / 1024)} kB), 8 readers`, read));
    else console.log(`  the widest chain did not store a revision (${wideAnswer.status}); readers skipped`);
    console.log(`  → ${hostile.p99 <= 3 * Math.max(1, idle.p99) ? "within target" : "OUTSIDE target"}; flood answers by status: ${JSON.stringify(floodAnswers)}`);
    if (!given) {
      console.log("\n4. scaling out: 2 web + 2 worker processes, 24 heavy solves");
      const single = await solveBatch([url], cookie, benchTeam, 24);
      server.child?.kill("SIGTERM");
      await new Promise((resolve) => server.child?.once("exit", resolve));
      const webs = [await startServer({ SOLVE_WORKER: "false", MAIL_WORKER: "false" }), await startServer({ SOLVE_WORKER: "false", MAIL_WORKER: "false" })];
      const workers = [1, 2].map((n) =>
        spawn(`${root}node_modules/.bin/tsx`, ["server/worker.ts"], { cwd: root, env: { ...process.env, INSTANCE_NAME: `bench-worker-${n}`, SOLVE_THREADS: "1" }, stdio: ["ignore", "ignore", "inherit"] }),
      );
      try {
        await new Promise((resolve) => setTimeout(resolve, 3_000));
        const spread = await solveBatch(webs.map((web) => web.url), cookie, benchTeam, 24);
        const rate = (batch: Batch) => `${(batch.solved / batch.seconds).toFixed(2)} solves/s, oldest wait in the queue ${batch.oldestWaitMs} ms, ${batch.solved}/${batch.asked} solved`;
        console.log(`  one server, its own ${config.solve.threads} thread(s) (reference)`.padEnd(48) + rate(single));
        console.log(`  2 web + 2 workers (1 thread each)`.padEnd(48) + rate(spread));
        console.log(`  → ${(spread.solved / spread.seconds / (single.solved / single.seconds)).toFixed(2)} × the reference's rate`);
      } finally {
        for (const child of [...webs.map((web) => web.child), ...workers]) child.kill("SIGTERM");
      }
    }
  } finally {
    if (benchTeam) await fetch(`${url}/api/teams/${benchTeam}`, { method: "DELETE", headers: { Origin: url, Cookie: cookie } }).catch(() => undefined);
    server.child?.kill("SIGTERM");
  }
  console.log("\n[bench:load] figures are for this machine, under whatever else runs on it.");
}

main().catch((error) => {
  console.error(`[bench:load] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
