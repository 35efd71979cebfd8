import sharp from 'sharp';
import { absolute, workspacePaths } from '#shared/routes.ts';
import { HALFTONE_METHODS } from '#shared/imaging/halftone/halftone.ts';
import { estimateBurnSeconds, formatBurnTime, speedInMmPerSecond } from '#shared/imaging/burn-time.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import { LASER_KIND_LABELS, SPEED_UNIT_LABELS, type LaserKind } from '#shared/schemas/catalog.ts';
import { masterPpi } from '#shared/studio.ts';
import type { BatchMachine, RenderFiles } from '#shared/schemas/production.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import { formatSize } from '#shared/units.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Env } from '#server/env.ts';
import type { Logger } from '#server/logger.ts';
import type { Orm } from '#server/db/orm.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { encodeBitmapPng } from '#server/imaging/png-1bit.ts';
import { burnPiece, writePieceMaster } from '#server/imaging/piece.ts';
import { originalPhoto, pieceOf } from '#server/features/prep/burn.service.ts';
import { OrderEvent, type OrderItem } from '../orders/order.entity.ts';
import { currentPrep } from '#server/features/prep/prep.service.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { jobSheetPdf } from './job-sheet.ts';
import { Render, type ProductionBatch } from './production.entity.ts';

/** Where each file of a render lives: the same keys on every attempt. */
export const renderKeys = (prefix: string) => ({
  engrave: `${prefix}/engrave.png`,
  master: `${prefix}/grayscale-master.png`,
  sheet: `${prefix}/job-sheet.pdf`,
});

/** Estimated time to burn one piece, or null when there is no recipe or its speed is not in a length per second. */
export function burnSecondsFor(item: OrderItem, prep: PrepSettings, machine: BatchMachine | null): number | null {
  const speed = machine && speedInMmPerSecond(machine.speed, machine.speedUnit);
  if (!machine || !speed) return null;
  const area = orientedArea(item.snapshot.size, item.orientation);
  return estimateBurnSeconds({
    widthMm: area.widthMm,
    heightMm: area.heightMm,
    linesPerInch: prep.linesPerInch,
    speedMmPerSecond: speed,
    passes: machine.passes,
  });
}

/** The job sheet's line for the estimate: the time, or why there is none. */
export function burnEstimateLine(seconds: number | null, machine: BatchMachine | null, quantity: number): string {
  if (!machine) return 'Not estimated: the material has no recipe for this machine.';
  if (seconds === null)
    return `Not estimated: the recipe’s speed is a share of the machine’s top speed (${SPEED_UNIT_LABELS[machine.speedUnit]}), not a length per second.`;
  return `${formatBurnTime(seconds)} per piece${quantity > 1 ? `, ${formatBurnTime(seconds * quantity)} for ${quantity}` : ''} (raster, 5 mm overscan)`;
}

type RenderDeps = { orm: Orm; storage: Storage; env: Pick<Env, 'APP_URL'>; logger: Logger };

/**
 * The render job: places the photo at the machine's resolution, makes the engrave file, the
 * grayscale master and the job sheet, and stores them. Safe to run again from the start after a
 * crash: each attempt overwrites the same three keys, and only a complete set marks it done.
 */
export async function runRender(
  { orm, storage, env, logger }: RenderDeps,
  renderId: string,
  attempt: { retryCount: number; retryLimit: number },
): Promise<void> {
  const em = orm.em.fork();
  // The worker serves every studio: it takes the render's studio before reading anything else.
  const [row] = await em
    .getConnection()
    .execute<Array<{ studio_id: string }>>('select "studio_id" from "render" where "id" = ?', [renderId]);
  if (!row) return; // taken out of its batch meanwhile
  em.setFilterParams(TENANT_FILTER, { studioId: row.studio_id });
  const render = await em.findOne(
    Render,
    { id: renderId },
    { populate: ['studio', 'batch', 'item', 'item.order', 'item.order.items', 'item.photo'] },
  );
  if (!render || render.status === 'done') return;
  render.status = 'running';
  render.attempts += 1;
  render.startedAt = new Date();
  render.error = null;
  render.progress = 2;
  render.step = 'Reading the photo';
  await em.flush();
  const report = (progress: number, step: string) =>
    em.nativeUpdate(Render, { id: renderId, status: 'running' }, { progress, step, updatedAt: new Date() });
  const keys = renderKeys(render.keyPrefix);
  try {
    const { item, studio, batch } = render;
    const prep = currentPrep(item);
    await report(10, 'Placing the photo at the machine’s resolution');
    const photo = await originalPhoto(storage, item);
    const piece = pieceOf(item);
    await report(30, 'Halftoning');
    const burned = await burnPiece(photo, piece, prep);
    const { bitmap } = burned;
    const engrave = encodeBitmapPng(bitmap, prep.linesPerInch);
    await storage.put(keys.engrave, engrave, 'image/png');
    const ppi = masterPpi(studio.masterResolution, prep.linesPerInch);
    await report(55, `Making the grayscale master at ${ppi} ppi`);
    const master = await writePieceMaster(piece, prep, burned, ppi);
    await storage.put(keys.master, master.png, 'image/png');
    await report(80, 'Writing the job sheet');
    const preview = await sharp(engrave).resize({ width: 340, height: 440, fit: 'inside', kernel: 'lanczos3' }).png().toBuffer();
    const sheet = await jobSheetPdf(
      jobSheetFor({
        studio,
        batch,
        item,
        prep,
        preview,
        appUrl: env.APP_URL,
        pixels: { width: bitmap.width, height: bitmap.height },
        version: item.prepVersions.at(-1)?.version ?? 0,
      }),
    );
    await storage.put(keys.sheet, sheet, 'application/pdf');
    const files: RenderFiles = {
      engrave: { key: keys.engrave, bytes: engrave.length, contentType: 'image/png', width: bitmap.width, height: bitmap.height },
      master: { key: keys.master, bytes: master.png.length, contentType: 'image/png', width: master.width, height: master.height },
      sheet: { key: keys.sheet, bytes: sheet.length, contentType: 'application/pdf' },
    };
    // Done only if it is still this render's turn (not taken out of the batch meanwhile).
    const marked = await em.nativeUpdate(
      Render,
      { id: renderId, status: 'running' },
      { status: 'done', progress: 100, step: 'Ready', files, finishedAt: new Date(), updatedAt: new Date() },
    );
    if (!marked) {
      // Taken out of its batch meanwhile: its files go with it. (Another attempt having finished
      // first leaves the row done, with the same keys: nothing to clean up.)
      if (!(await em.count(Render, { id: renderId }))) await Promise.all(Object.values(keys).map((key) => storage.remove(key)));
      return;
    }
    em.create(OrderEvent, {
      studio,
      order: item.order,
      item,
      type: 'rendered',
      actor: 'Etchwell',
      text: `Engrave file, grayscale master and job sheet made for batch ${batch.number}${render.attempts > 1 ? ` (attempt ${render.attempts})` : ''}.`,
    });
    await em.flush();
  } catch (error) {
    const message = (error as Error).message.slice(0, 500);
    const willRetry = attempt.retryCount < attempt.retryLimit;
    logger.warn({ renderId, attempt: render.attempts, willRetry, err: error }, 'render failed');
    await em.nativeUpdate(
      Render,
      { id: renderId, status: 'running' },
      {
        status: willRetry ? 'queued' : 'failed',
        error: message,
        step: willRetry ? 'Failed; trying again shortly' : 'Failed',
        updatedAt: new Date(),
      },
    );
    throw error;
  }
}

function jobSheetFor(input: {
  studio: Studio;
  batch: ProductionBatch;
  item: OrderItem;
  prep: PrepSettings;
  preview: Buffer;
  appUrl: string;
  pixels: { width: number; height: number };
  version: number;
}) {
  const { studio, batch, item, prep, preview, appUrl, pixels, version } = input;
  const { order, snapshot } = item;
  const area = orientedArea(snapshot.size, item.orientation);
  const machine = batch.machine;
  const seconds = burnSecondsFor(item, prep, machine);
  // The collection is loaded in cart order (OrderItem.position).
  const index = order.items.getItems().findIndex((i) => i.id === item.id) + 1;
  const rows: Array<[string, string | null]> = [
    ['Order', null],
    ['Buyer', order.buyerName],
    ['Delivery', order.deliveryMethod === 'pickup' ? 'Pickup at the studio' : `Ship: ${order.shippingRate?.name ?? 'shipping'}`],
    ['Quantity', String(item.quantity)],
    ['Piece', null],
    ['Blank', snapshot.blank.name],
    ['Material', snapshot.blank.material.name],
    ['Size', snapshot.size.label],
    [
      'Engraving area',
      `${formatSize(area.widthMm, area.heightMm, 'mm')} (${formatSize(area.widthMm, area.heightMm, 'in')}), ${item.orientation}`,
    ],
    ['Inscription', item.inscription ? `“${item.inscription.lines.filter(Boolean).join(' / ')}”, in the engrave file` : 'none'],
    ['Machine', null],
    ...(machine
      ? ([
          ['Machine', `${machine.name} (${LASER_KIND_LABELS[machine.laserKind as LaserKind] ?? machine.laserKind})`],
          ['Speed', `${machine.speed} ${SPEED_UNIT_LABELS[machine.speedUnit]}`],
          ['Power', `${machine.powerMinPercent}–${machine.powerMaxPercent} %`],
          ['Passes', String(machine.passes)],
          ...(machine.notes ? [['Recipe notes', machine.notes] as [string, string]] : []),
        ] as Array<[string, string]>)
      : ([['Recipe', 'None for this material: set speed and power by the machine maker’s guidance and a test burn.']] as Array<
          [string, string]
        >)),
    ['File', null],
    ['Line density', `${prep.linesPerInch} lines per inch`],
    ['Halftone', HALFTONE_METHODS[prep.halftoneMethod]],
    ['Tone', prep.negative ? 'Negative (the laser marks light)' : 'Positive (the laser marks dark)'],
    ['Pixels', `${pixels.width} × ${pixels.height}`],
    ['Prep version', version ? String(version) : 'recipe defaults'],
    ['Estimated burn', burnEstimateLine(seconds, machine, item.quantity)],
  ];
  return {
    studioName: studio.name,
    title: `Order ${order.number}: item ${index} of ${order.items.length}`,
    subtitle: `Batch ${batch.number} · ${snapshot.blank.name}, ${snapshot.size.label}`,
    orderUrl: absolute(appUrl, workspacePaths.order(studio.slug, order.id)),
    preview,
    rows,
    checks: [
      'The blank is the right material and size',
      'A test burn on scrap of the same material looks right',
      'The engraving matches the preview',
      'The piece is cleaned and checked',
      `Packed with order ${order.number}`,
    ],
    paper: studio.units === 'in' ? ('LETTER' as const) : ('A4' as const),
  };
}
