// Mail leaves the request path: a request enqueues a pg-boss job and a worker delivers it, retrying
// with a pause, then parking it in the dead-letter queue (common practice for job queues); one
// idempotency key is one mail.
import { createServer, type Server, type Socket } from "node:net";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createPool } from "../../server/db/client.js";
import { ApiClient } from "../support/api.js";
import { uniqueEmail } from "../support/fixtures.js";
import { mailCount, waitForMail } from "../support/mail.js";
import { startTestServer, testDatabaseUrl, type TestServer } from "../support/server.js";

interface JobRow {
  state: string;
  retry_count: number;
}

async function jobsTo(server: TestServer, queue: string, to: string): Promise<JobRow[]> {
  const { rows } = await server.pool.query<JobRow>("select state::text as state, retry_count from pgboss.job where name = $1 and data->>'to' = $2", [queue, to]);
  return rows;
}

async function until<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = await probe();
    if (found) return found;
    if (Date.now() > deadline) throw new Error("gave up waiting");
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

// Old jobs of an earlier run would otherwise keep this server's worker busy.
async function emptyQueues(...queues: string[]): Promise<void> {
  const pool = createPool(testDatabaseUrl(), 1);
  await pool.query("delete from pgboss.job where name = any($1)", [queues]).catch(() => undefined);
  await pool.end();
}

// Takes the connection and never sends the SMTP greeting.
async function silentSmtp(): Promise<{ port: number; connections: () => number; close(): Promise<void> }> {
  const sockets = new Set<Socket>();
  let connections = 0;
  const server: Server = createServer((socket) => {
    connections += 1;
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return {
    port: (server.address() as AddressInfo).port,
    connections: () => connections,
    close: async () => {
      for (const socket of sockets) socket.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

// A loopback port with nobody listening: every delivery is refused at once.
async function refusedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe("sign-up with an SMTP server that never answers", () => {
  const queue = "mail-silent-smtp-test";
  let smtp: Awaited<ReturnType<typeof silentSmtp>>;
  let server: TestServer;
  beforeAll(async () => {
    await emptyQueues(queue, `${queue}-dead`);
    smtp = await silentSmtp();
    server = await startTestServer({ smtp: { host: "127.0.0.1", port: smtp.port, timeoutMs: 1_000 }, mailQueue: { queue, retryLimit: 3, retryDelaySeconds: 1 } });
  });
  afterAll(async () => {
    await server.close();
    await smtp.close();
  });

  it("answers before the mail is sent, and the mail job is retried", async () => {
    const email = uniqueEmail("silent-smtp");
    const response = await new ApiClient(server.url).post("/api/auth/signup", { email, password: "a patient signup", name: "Sam Silent" });
    expect(response.status).toBe(201);
    // The answer came while the mail still waits in the queue: not delivered, not given up.
    expect(await mailCount(server.db, email)).toBe(0);
    const [job] = await jobsTo(server, queue, email);
    expect(job).toBeDefined();
    expect(["created", "active", "retry"]).toContain(job.state);
    expect(job.retry_count).toBe(0);
    // The first delivery times out against the silent server; pg-boss tries again.
    const retried = await until(async () => (await jobsTo(server, queue, email)).find((row) => row.retry_count >= 1));
    expect(retried.retry_count).toBeGreaterThanOrEqual(1);
    // The job is marked for retry when the first try fails; the second try connects a retry delay later.
    expect(await until(async () => smtp.connections() >= 2)).toBe(true);
    expect(await mailCount(server.db, email)).toBe(0);
  });
});

describe("a mail whose SMTP target refuses every delivery", () => {
  const queue = "mail-refused-smtp-test";
  let server: TestServer;
  beforeAll(async () => {
    await emptyQueues(queue, `${queue}-dead`);
    server = await startTestServer({ smtp: { host: "127.0.0.1", port: await refusedPort() }, mailQueue: { queue, retryLimit: 2, retryDelaySeconds: 1 } });
  });
  afterAll(async () => {
    await server.close();
  });

  it("ends in the dead-letter queue, listed by GET /api/dev/mail-queue", async () => {
    const email = uniqueEmail("refused-smtp");
    const client = new ApiClient(server.url);
    expect((await client.post("/api/auth/signup", { email, password: "refused every time", name: "Rae Refused" })).status).toBe(201);
    const dead = await until(async () => {
      const report = await client.get("/api/dev/mail-queue");
      expect(report.status).toBe(200);
      return report.body.dead.find((mail: { to: string }) => mail.to === email);
    });
    expect(dead.subject).toMatch(/Confirm your e-mail address/);
    // The original job used its retries (2 after the first try) and failed for good.
    const [original] = await jobsTo(server, queue, email);
    expect(original).toEqual({ state: "failed", retry_count: 2 });
    const report = await client.get("/api/dev/mail-queue");
    expect(report.body.pending.some((mail: { to: string }) => mail.to === email)).toBe(false);
    expect(await mailCount(server.db, email)).toBe(0);
  });
});

describe("the same mail enqueued twice with one key", () => {
  const queue = "mail-one-key-test";
  let server: TestServer;
  beforeAll(async () => {
    await emptyQueues(queue, `${queue}-dead`);
    server = await startTestServer({ mailQueue: { queue } });
  });
  afterAll(async () => {
    await server.close();
  });

  it("is sent once; another key is another mail", async () => {
    const to = uniqueEmail("one-key");
    const mail = { to, subject: "Review notice: sensor front end revision 3", text: "Rsens was changed.", html: "<p>Rsens was changed.</p>" };
    expect(await server.mailer.send({ ...mail, key: "sensor-front-end-r3-notice" })).toBe(true);
    expect(await server.mailer.send({ ...mail, key: "sensor-front-end-r3-notice" })).toBe(true);
    expect(await server.mailer.send({ ...mail, key: "sensor-front-end-r3-notice-again" })).toBe(true);
    await waitForMail(server.db, to, { timeoutMs: 15_000 });
    // Wait until nothing for this address is left in the queue, then count what arrived.
    await until(async () => (await jobsTo(server, queue, to)).every((row) => row.state === "completed"));
    expect((await jobsTo(server, queue, to)).length).toBe(2);
    await until(async () => (await mailCount(server.db, to)) === 2);
    expect(await mailCount(server.db, to)).toBe(2);
  });
});
