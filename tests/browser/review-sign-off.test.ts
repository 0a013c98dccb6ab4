// A design review signed off in chromium: the author solves, a reviewer notes a step and requests
// changes, the author answers with a new revision, the reviewer approves it; the mails arrive in the
// local mailbox. The rules it walks are common practice for sign-off (no approving one's own work,
// a change request says why, a newer revision is reviewed afresh).
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { teamMembers } from "../../server/db/schema.js";
import { launchBrowser, screenshotDir, type TestBrowser } from "../support/browser.js";
import { fixturePassword, followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { waitForMail } from "../support/mail.js";
import { startTestServer, type TestServer } from "../support/server.js";
import { watchPage } from "./page-watch.js";
import { shot, signInThroughForm } from "./page-steps.js";

describe("review sign-off in chromium", () => {
  let server: TestServer;
  let authorBrowser: TestBrowser;
  let reviewerBrowser: TestBrowser;
  let authorPage: Page;
  let reviewerPage: Page;
  let author: Person;
  let reviewer: Person;
  let networkId = "";
  let teamId = "";
  const title = "Bridge sense buffer";
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    server = await startTestServer();
    [author, reviewer] = await Promise.all([signedInPerson(server, "author"), signedInPerson(server, "reviewer")]);
    teamId = (await author.client.post("/api/teams", { name: "Sensor front-end review" })).body.id;
    await server.db.insert(teamMembers).values({ teamId, userId: reviewer.user.id, role: "reviewer" });
    networkId = (await author.client.post(`/api/teams/${teamId}/networks`, { title, circuit: followerCircuit })).body.id;
    [authorBrowser, reviewerBrowser] = await Promise.all([launchBrowser(), launchBrowser()]);
    authorPage = watchPage(await authorBrowser.context.newPage(), pageErrors);
    reviewerPage = watchPage(await reviewerBrowser.context.newPage(), pageErrors);
    await signInThroughForm(authorPage, server.url, { email: author.user.email, password: fixturePassword });
    await signInThroughForm(reviewerPage, server.url, { email: reviewer.user.email, password: fixturePassword });
  });
  afterAll(async () => {
    await reviewerBrowser?.close();
    await authorBrowser?.close();
    await server?.close();
  });

  // A loaded machine: a request with its mails and the refetch after it may take seconds.
  const soon = { timeout: 15_000 };
  const status = (page: Page) => page.getByRole("status", { name: "Review state" });

  it("the author solves revision 1: open, not yet reviewed, and no Approve button for the author", async () => {
    await authorPage.goto(`${server.url}/networks/${networkId}`);
    await authorPage.getByRole("button", { name: "Solve", exact: true }).click();
    await authorPage.waitForURL(/\/r\/1$/, { timeout: 30_000 });
    await expect.poll(() => status(authorPage).textContent(), soon).toContain("not yet reviewed");
    await authorPage.getByRole("button", { name: "Request changes" }).waitFor();
    expect(await authorPage.getByRole("button", { name: "Approve", exact: true }).count()).toBe(0);
    await shot(authorPage, "sign-off-1-author-solved");
  });

  it("the reviewer finds it awaiting review, notes a step and requests changes with a note", async () => {
    await reviewerPage.goto(`${server.url}/reviews/awaiting`);
    await reviewerPage.getByRole("link", { name: title }).waitFor();
    await shot(reviewerPage, "sign-off-2-awaiting-my-review");
    await reviewerPage.getByRole("link", { name: title }).click();
    await reviewerPage.waitForURL(/\/r\/1$/);

    await reviewerPage.getByRole("button", { name: /^Add a note on step 1,/ }).click();
    await reviewerPage.getByLabel(/^Note on step 1,/).fill("Which node is the reference for the KCL rows?");
    await reviewerPage.getByRole("button", { name: "Add note" }).click();
    await expect.poll(() => status(reviewerPage).textContent(), soon).toContain("1 open note");

    await reviewerPage.getByRole("button", { name: "Request changes" }).click();
    const dialog = reviewerPage.getByRole("dialog", { name: "Request changes on revision 1" });
    // No change request without saying what has to change.
    expect(await dialog.getByRole("button", { name: "Record change request" }).isDisabled()).toBe(true);
    await dialog.getByLabel("What has to change (required)").fill("Name the reference node, and give Ro its trace resistance.");
    await shot(reviewerPage, "sign-off-3-request-changes-dialog");
    await dialog.getByRole("button", { name: "Record change request" }).click();
    await expect.poll(() => status(reviewerPage).textContent(), soon).toContain(`changes requested by ${reviewer.user.name}`);
    await shot(reviewerPage, "sign-off-4-changes-requested");
  });

  it("the author is mailed, reads the state and the history, and resolves the note", async () => {
    const mail = await waitForMail(server.db, author.user.email, { subject: /needs changes/, timeoutMs: 10_000 });
    expect(mail.text).toContain("Name the reference node");
    await waitForMail(server.db, author.user.email, { subject: /New comment/ });

    await authorPage.reload();
    await expect.poll(() => status(authorPage).textContent(), soon).toContain("needs changes");
    await authorPage.getByText("Verdict history (1)").click();
    await authorPage.getByRole("list", { name: "Verdict history" }).getByText("Name the reference node", { exact: false }).waitFor();
    await authorPage.getByRole("complementary", { name: /^Review notes on step 1,/ }).getByRole("button", { name: "Resolve" }).click();
    await authorPage.getByText(`Resolved by ${author.user.name}`).waitFor();
    await expect.poll(() => status(authorPage).textContent(), soon).toContain("0 open notes");
    await shot(authorPage, "sign-off-5-author-reads-history");
  });

  it("the author solves a new revision, which starts open", async () => {
    const circuit = { ...followerCircuit, elements: followerCircuit.elements.map((e) => (e.name === "Rout" ? { ...e, value: "Ro + Rtrace" } : e)) };
    expect((await author.client.patch(`/api/networks/${networkId}`, { circuit })).status).toBe(200);
    await authorPage.goto(`${server.url}/networks/${networkId}`);
    await authorPage.getByRole("button", { name: "Solve", exact: true }).click();
    await authorPage.waitForURL(/\/r\/2$/, { timeout: 30_000 });
    await expect.poll(() => status(authorPage).textContent(), soon).toContain("Revision 2: open");
  });

  it("the reviewer approves revision 2, told of the open note first", async () => {
    await reviewerPage.goto(`${server.url}/reviews/awaiting`);
    await reviewerPage.getByRole("cell", { name: "revision 2" }).waitFor();
    await reviewerPage.getByRole("link", { name: title }).click();
    await reviewerPage.waitForURL(/\/r\/2$/);
    await reviewerPage.getByRole("button", { name: /^Add a note on step 2,/ }).click();
    await reviewerPage.getByLabel(/^Note on step 2,/).fill("Rtrace could be listed in the assumptions.");
    await reviewerPage.getByRole("button", { name: "Add note" }).click();
    await expect.poll(() => status(reviewerPage).textContent(), soon).toContain("1 open note");

    await reviewerPage.getByRole("button", { name: "Approve", exact: true }).click();
    const dialog = reviewerPage.getByRole("dialog", { name: "Approve revision 2" });
    await dialog.getByText("1 note thread is still open on this revision. Approve anyway?").waitFor();
    await dialog.getByLabel("Note (optional)").fill("Good to go to layout.");
    await shot(reviewerPage, "sign-off-6-approve-with-open-note");
    await dialog.getByRole("button", { name: "Approve with open notes" }).click();
    await expect.poll(() => status(reviewerPage).textContent(), soon).toContain(`approved by ${reviewer.user.name}`);
    await shot(reviewerPage, "sign-off-7-approved");
  });

  it("the approval mail reaches the author's mailbox; a newer revision names the approved one and compares with it", async () => {
    const mail = await waitForMail(server.db, author.user.email, { subject: /approved/, timeoutMs: 10_000 });
    expect(mail.text).toContain("Good to go to layout.");
    await authorPage.goto(`${server.url}/dev/mailbox?to=${encodeURIComponent(author.user.email)}`);
    await authorPage.getByText(mail.subject).first().waitFor();
    await shot(authorPage, "sign-off-8-author-mailbox");

    await authorPage.goto(`${server.url}/networks/${networkId}`);
    await authorPage.getByRole("button", { name: "Solve", exact: true }).click();
    await authorPage.waitForURL(/\/r\/3$/, { timeout: 30_000 });
    await expect.poll(() => status(authorPage).textContent(), soon).toContain("revision 2 approved; this one not yet reviewed");
    await shot(authorPage, "sign-off-9-newer-revision-open");
    await authorPage.getByRole("link", { name: "compare with revision 2" }).click();
    await authorPage.getByRole("region", { name: "Revision 2 compared with 3" }).waitFor();

    await authorPage.goto(`${server.url}/reviews/mine`);
    await authorPage.getByRole("cell", { name: "revision 3" }).waitFor();
    await shot(authorPage, "sign-off-10-my-revisions-in-review");
  });

  it("the shared page says at the top who approved revision 2 and when", async () => {
    const token = (await author.client.post(`/api/networks/${networkId}/revisions/2/share`, {})).body.token;
    const guestBrowser = await launchBrowser();
    const guest = await guestBrowser.context.newPage();
    watchPage(guest, pageErrors);
    await guest.goto(`${server.url}/s/${token}`);
    await expect.poll(() => status(guest).textContent(), soon).toContain(`Revision 2: approved by ${reviewer.user.name}`);
    await shot(guest, "sign-off-11-shared-approved");
    await guestBrowser.close();
  });

  it("the author turns review mail off in the account settings; the team page sets required approvals and warns of owner invitations", async () => {
    await authorPage.goto(`${server.url}/account`);
    const toggle = authorPage.getByLabel(/^Send me review mail/);
    expect(await toggle.isChecked()).toBe(true);
    await toggle.click();
    await expect.poll(async () => (await author.client.get("/api/me")).body.settings.reviewMail, soon).toBe(false);
    await shot(authorPage, "sign-off-12-account-settings");

    await authorPage.goto(`${server.url}/teams/${teamId}`);
    await authorPage.getByLabel("Approvals a revision needs").fill("2");
    await authorPage.getByRole("button", { name: "Save", exact: true }).click();
    await expect.poll(async () => (await author.client.get(`/api/teams/${teamId}`)).body.requiredApprovals, soon).toBe(2);
    await authorPage.getByLabel("Role", { exact: true }).selectOption("owner");
    await authorPage.getByText("An owner can change every member's role").waitFor();
    await shot(authorPage, "sign-off-13-team-review-settings");
  });

  it("raised no uncaught error and no console error on the way", () => {
    expect(pageErrors).toEqual([]);
  });
});
