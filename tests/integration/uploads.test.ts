import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { followerCircuit, signedInPerson, type Person } from "../support/fixtures.js";
import { startTestServer, type TestServer } from "../support/server.js";

// File signatures, from the formats' own specifications: PNG (ISO/IEC 15948, the 8-byte signature),
// JPEG (ITU-T T.81, the SOI marker FF D8 followed by a marker FF xx), PDF (ISO 32000-1 §7.5.2, "%PDF-").
const png = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");
const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from("JFIF\0"), Buffer.alloc(64, 1), Buffer.from([0xff, 0xd9])]);
const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");

const followerNetlist = `# strain-gauge buffer, our own scenario
port out 0
Vbridge voltage in 0 = Vs
Amp voltage x 0 = A * across(in, out)
Rout resistor x out = Ro
`;

describe("uploads: importing networks and attaching files", () => {
  let server: TestServer;
  let editor: Person;
  let teamId: string;
  let networkId: string;
  beforeAll(async () => {
    server = await startTestServer({ limits: { importBytes: 2_048, attachmentBytes: 64 * 1024 } });
    editor = await signedInPerson(server, "uploader");
    teamId = (await editor.client.post("/api/teams", { name: "Upload lab" })).body.id;
    networkId = (await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Attachments here", circuit: followerCircuit })).body.id;
  });
  afterAll(async () => {
    await server.close();
  });

  const importPath = () => `/api/teams/${teamId}/networks/import`;

  it("imports our JSON and our text netlist to the same network", async () => {
    const json = await editor.client.upload(importPath(), { name: "follower.json", type: "application/json", content: JSON.stringify(followerCircuit) });
    expect(json.status).toBe(201);
    expect(json.body).toMatchObject({ title: "follower", importedFrom: "json" });
    const text = await editor.client.upload(importPath(), { name: "follower.pfn", type: "application/octet-stream", content: followerNetlist }, { title: "Imported buffer" });
    expect(text.status).toBe(201);
    expect(text.body).toMatchObject({ title: "Imported buffer", importedFrom: "text" });
    expect(text.body.circuit).toEqual(json.body.circuit);
  });

  it("refuses a netlist with errors, with the engine's diagnostics by line and column", async () => {
    const broken = followerNetlist.replace("Amp voltage x 0", "Amp amplifier x 0");
    const response = await editor.client.upload(importPath(), { name: "broken.pfn", type: "text/plain", content: broken });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe("invalid_network_file");
    // Line 4 of the file, the kind word starts in column 5.
    expect(response.body.error.diagnostics).toEqual([expect.objectContaining({ code: "parse-error", line: 4, column: 5 })]);
    const badJson = await editor.client.upload(importPath(), { name: "broken.json", type: "application/json", content: '{ "port": ' });
    expect(badJson.status).toBe(400);
    expect(badJson.body.error.diagnostics[0].code).toBe("invalid-json");
  });

  it("refuses a file and a circuit in the earlier format with 400, naming the new word for the old one", async () => {
    const earlier = followerNetlist.replace("Amp voltage x 0", "Amp vcvs x 0");
    const file = await editor.client.upload(importPath(), { name: "earlier.pfn", type: "text/plain", content: earlier });
    expect(file.status).toBe(400);
    expect(file.body.error.diagnostics[0]).toMatchObject({ code: "parse-error", line: 4, column: 5 });
    expect(file.body.error.diagnostics[0].message).toContain("`vcvs` is now `voltage` with a value such as `A * across(in, out)`");
    const circuit = { port: { plus: "out", minus: "0" }, elements: [{ name: "Drive", kind: "vsource", nodes: ["out", "0"], value: "Vs" }] };
    const created = await editor.client.post(`/api/teams/${teamId}/networks`, { title: "Earlier shape", circuit });
    expect(created.status).toBe(400);
    expect(created.body.error.diagnostics[0]).toMatchObject({ code: "format-renamed", path: ["elements", 0, "kind"] });
    expect(created.body.error.diagnostics[0].message).toContain("`vsource` is now `voltage`");
  });

  it("refuses files over the size limit (413) and of the wrong type (415)", async () => {
    const large = `${followerNetlist}${"# padding\n".repeat(300)}`;
    const tooLarge = await editor.client.upload(importPath(), { name: "large.pfn", type: "text/plain", content: large });
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error.code).toBe("too_large");
    const image = await editor.client.upload(importPath(), { name: "schematic.png", type: "image/png", content: png });
    expect(image.status).toBe(415);
    const binary = await editor.client.upload(importPath(), { name: "follower.pfn", type: "text/plain", content: Buffer.from([0x00, 0xff, 0xfe, 0x00]) });
    expect(binary.status).toBe(415);
    const noFile = await editor.client.post(importPath(), { file: followerNetlist });
    expect(noFile.status).toBe(400);
    const form = new FormData();
    form.append("netlist", new Blob([followerNetlist]), "follower.pfn");
    expect((await editor.client.request("POST", importPath(), form)).status).toBe(400);
    const truncated = await editor.client.request("POST", importPath(), "--x\r\nContent-Disposition: form-data; name=\"file\"; filename=\"a.pfn\"\r\n\r\nport", {
      "Content-Type": "multipart/form-data; boundary=x",
    });
    expect(truncated.status).toBe(400);
  });

  it("stores PNG, JPEG and PDF attachments and serves them with their type and Content-Disposition", async () => {
    const path = `/api/networks/${networkId}/attachments`;
    for (const [name, type, content] of [
      ["scope capture.png", "image/png", png],
      ["bench photo.jpg", "image/jpeg", jpeg],
      ["Datenblatt Verstärker.pdf", "application/pdf", pdf],
    ] as const) {
      const uploaded = await editor.client.upload(path, { name, type, content });
      expect(uploaded.status).toBe(201);
      expect(uploaded.body).toMatchObject({ filename: name, contentType: type, size: content.length });
      const served = await fetch(`${server.url}${path}/${uploaded.body.id}`, { headers: { Cookie: editor.client.cookie! } });
      expect(served.status).toBe(200);
      expect(served.headers.get("content-type")).toBe(type);
      // RFC 6266: attachment with a quoted ASCII fallback and, for non-ASCII names, an RFC 8187 filename*.
      const disposition = served.headers.get("content-disposition")!;
      expect(disposition.startsWith("attachment; filename=")).toBe(true);
      if (/^[\x20-\x7e]*$/.test(name)) expect(disposition).toBe(`attachment; filename="${name}"`);
      else expect(disposition).toContain(`filename*=UTF-8''${encodeURIComponent(name)}`);
      expect(served.headers.get("x-content-type-options")).toBe("nosniff");
      expect(Buffer.from(await served.arrayBuffer()).equals(content)).toBe(true);
    }
    const listed = await editor.client.get(path);
    expect(listed.body.attachments.map((a: { filename: string }) => a.filename)).toEqual(["scope capture.png", "bench photo.jpg", "Datenblatt Verstärker.pdf"]);
    const first = listed.body.attachments[0].id;
    expect((await editor.client.delete(`${path}/${first}`)).status).toBe(204);
    expect((await editor.client.get(`${path}/${first}`)).status).toBe(404);
  });

  it("refuses attachments that are not PDF, PNG or JPEG, that lie about their type, or that are too large", async () => {
    const path = `/api/networks/${networkId}/attachments`;
    const text = await editor.client.upload(path, { name: "notes.txt", type: "text/plain", content: "just text" });
    expect(text.status).toBe(415);
    const html = await editor.client.upload(path, { name: "page.png", type: "image/png", content: "<html><script>alert(1)</script></html>" });
    expect(html.status).toBe(415);
    const mislabelled = await editor.client.upload(path, { name: "capture.pdf", type: "application/pdf", content: png });
    expect(mislabelled.status).toBe(415);
    expect(mislabelled.body.error.code).toBe("type_mismatch");
    const huge = Buffer.concat([png, Buffer.alloc(70 * 1024)]);
    const tooLarge = await editor.client.upload(path, { name: "huge.png", type: "image/png", content: huge });
    expect(tooLarge.status).toBe(413);
  });
});
