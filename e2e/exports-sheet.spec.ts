import pg from "pg";
import { expect, test } from "./helpers/test";
import { signIn } from "./helpers/sign-in";

// The shop files through the running production build: a signed-in member downloads the sheet,
// hole list, drilling template, Bolting kit and Pass log of a seeded design (the Pass log PDF from
// the Shop files panel), and a queued sheet finishes in the server's own pg-boss worker.
test("a member downloads the shop files of a seeded design and a queued sheet finishes", async ({
  page,
  baseURL,
}) => {
  const anonymous = await page.request.get("/api/v1/jobs/00000000-0000-4000-8000-000000000000");
  expect(anonymous.status()).toBe(401);

  await signIn(page, "dana.designer@kestrel-ridge.example");
  const list = await page.request.get("/api/v1/designs");
  expect(list.ok()).toBe(true);
  const { items } = (await list.json()) as {
    items: { designId: string; revisionNumber: number; equipmentTag: string }[];
  };
  expect(items.length).toBeGreaterThan(0);
  const design = items[0];
  const base = `/api/v1/designs/${design.designId}/revisions/${design.revisionNumber}`;

  const pdf = await page.request.get(`${base}/sheet.pdf?paper=letter&units=US`);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  expect(pdf.headers()["content-disposition"]).toMatch(
    new RegExp(`-rev${design.revisionNumber}-spacing-sheet\\.pdf"$`),
  );
  expect((await pdf.body()).subarray(0, 5).toString()).toBe("%PDF-");

  const csv = await page.request.get(`${base}/holes.csv`);
  expect(csv.status()).toBe(200);
  expect((await csv.text()).split("\r\n")[0]).toMatch(
    /^number,id,angle_deg_cw_from_top,x_(mm|in),y_(mm|in),/,
  );
  const dxf = await page.request.get(`${base}/drilling.dxf`);
  expect(dxf.status()).toBe(200);
  expect(await dxf.text()).toContain("HOLES");
  expect(await dxf.text()).toContain("HOLE-NOTES");
  const kit = await page.request.get(`${base}/bolting-kit.csv`);
  expect(kit.status()).toBe(200);
  expect((await kit.text()).split("\r\n")[0]).toMatch(/^item,part,description,size,length_(mm|in),/);
  const log = await page.request.get(`${base}/pass-log.csv`);
  expect(log.status()).toBe(200);
  expect((await log.text()).split("\r\n")[0]).toMatch(/^pass,pass_name,pattern,/);

  // The Shop files panel offers the new downloads; the Pass log PDF follows the paper and units.
  await page.goto(`/designs/${design.designId}`);
  const panel = page.getByRole("region", { name: "Shop files" }).last();
  for (const [label, path] of [
    ["Bolting kit (CSV)", "bolting-kit.csv"],
    ["Pass log (CSV)", "pass-log.csv"],
  ])
    await expect(panel.getByRole("link", { name: label })).toHaveAttribute("href", `${base}/${path}`);
  await panel.getByLabel("Paper").selectOption("letter");
  const logPdf = panel.getByRole("link", { name: "Pass log (PDF)" });
  await expect(logPdf).toHaveAttribute("href", new RegExp(`^${base}/pass-log\\.pdf\\?paper=letter&units=`));
  const [download] = await Promise.all([page.waitForEvent("download"), logPdf.click()]);
  expect(download.suggestedFilename()).toMatch(new RegExp(`-rev${design.revisionNumber}-pass-log\\.pdf$`));

  const queued = await page.request.post(`${base}/sheet.pdf?paper=a4&units=SI`, {
    headers: { origin: new URL(baseURL!).origin },
  });
  expect(queued.status()).toBe(202);
  const { statusUrl } = (await queued.json()) as { statusUrl: string };
  let job = { status: "queued", downloadUrl: null as string | null, error: null as string | null };
  await expect
    .poll(
      async () => {
        job = (await (await page.request.get(statusUrl)).json()) as typeof job;
        return job.status;
      },
      { timeout: 30_000, intervals: [250, 500, 1000] },
    )
    .toMatch(/done|failed/);
  expect(job.error).toBeNull();
  expect(job.status).toBe("done");
  const file = await page.request.get(job.downloadUrl!);
  expect(file.status()).toBe(200);
  expect((await file.body()).subarray(0, 5).toString()).toBe("%PDF-");
});

// A sheet whose queue job died (as the dead-letter worker or the sweep leave it): the Shop files
// panel shows it failed, with its reason, and Retry sheet queues it again until it is done.
test("the Shop files panel shows a failed sheet with Retry sheet, which queues it again", async ({
  page,
}) => {
  test.setTimeout(90_000);
  await signIn(page, "dana.designer@kestrel-ridge.example");
  const { items } = (await (await page.request.get("/api/v1/designs")).json()) as {
    items: { designId: string; revisionNumber: number; equipmentTag: string }[];
  };
  const design = items[0];
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  let exportId = "";
  try {
    const { rows } = await client.query<{ id: string; organization_id: string; requested_by: string }>(
      `select r.id, r.organization_id, d.owner_id as requested_by from design_revisions r
         join designs d on d.id = r.design_id where r.design_id = $1 and r.number = $2`,
      [design.designId, design.revisionNumber],
    );
    const revision = rows[0]!;
    const inserted = await client.query<{ id: string }>(
      `insert into export_files (organization_id, design_id, revision_id, kind, options, status, file_name,
         content_type, error, requested_by, finished_at)
       values ($1, $2, $3, 'spacing-sheet', $4, 'failed', $5, 'application/pdf', $6, $7, now()) returning id`,
      [
        revision.organization_id,
        design.designId,
        revision.id,
        JSON.stringify({ revisionNumber: design.revisionNumber, paper: "a4", units: "SI" }),
        "retried-spacing-sheet.pdf",
        "The sheet was not finished: the worker preparing it stopped or ran out of time, on each of 3 attempts. Use Retry sheet to queue it again.",
        revision.requested_by,
      ],
    );
    exportId = inserted.rows[0]!.id;

    await page.goto(`/designs/${design.designId}`);
    const panel = page.getByRole("region", { name: "Shop files" });
    await expect(panel.getByText(/the worker preparing it stopped or ran out of time/)).toBeVisible();
    await panel.getByRole("button", { name: "Retry sheet" }).click();
    await expect(panel.getByRole("link", { name: "Download retried-spacing-sheet.pdf" })).toBeVisible({
      timeout: 30_000,
    });
    await expect(panel.getByRole("button", { name: "Retry sheet" })).toHaveCount(0);
    const { rows: after } = await client.query<{ status: string; byte_size: number }>(
      "select status, byte_size from export_files where id = $1",
      [exportId],
    );
    expect(after[0]).toMatchObject({ status: "done" });
    expect(after[0]!.byte_size).toBeGreaterThan(10_000);
  } finally {
    await client.end();
  }
});
