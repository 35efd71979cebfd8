import { z } from 'zod';
import { ITEM_STAGES } from '../orders/stages.ts';

/** Production: batches of approved items, their renders and downloads, burning and shipping. */
export const RENDER_STATUSES = ['queued', 'running', 'done', 'failed'] as const;
export type RenderStatus = (typeof RENDER_STATUSES)[number];

export const RENDER_FILE_KINDS = ['engrave', 'master', 'sheet'] as const;
export type RenderFileKind = (typeof RENDER_FILE_KINDS)[number];
export const RENDER_FILE_LABELS: Record<RenderFileKind, string> = {
  engrave: 'Engrave file',
  master: 'Grayscale master',
  sheet: 'Job sheet',
};

/** One stored file of a render. */
export const renderFileSchema = z.object({
  key: z.string(),
  bytes: z.number().int(),
  contentType: z.string(),
  width: z.number().int().optional(),
  height: z.number().int().optional(),
});
export type RenderFile = z.infer<typeof renderFileSchema>;
export type RenderFiles = Record<RenderFileKind, RenderFile>;

/** A batch's machine and settings, copied when it starts so later catalog edits do not change it. */
export type BatchMachine = {
  name: string;
  laserKind: string;
  speed: number;
  speedUnit: 'mm/s' | 'in/s' | 'percent';
  powerMinPercent: number;
  powerMaxPercent: number;
  passes: number;
  notes: string;
};

export const createBatchInputSchema = z.object({
  itemIds: z
    .array(z.uuid('Choose items from the list.'), { error: 'Choose the items to burn together.' })
    .min(1, 'Choose at least one item.')
    .max(50, 'A batch holds at most 50 items.'),
});
export type CreateBatchInput = z.infer<typeof createBatchInputSchema>;

export const renderViewSchema = z.object({
  id: z.uuid(),
  status: z.enum(RENDER_STATUSES),
  progress: z.number().int(),
  step: z.string(),
  attempts: z.number().int(),
  error: z.string().nullable(),
  /** Running, but no word from the worker for longer than a render may take: it can be retried. */
  stalled: z.boolean(),
  prepVersion: z.number().int(),
  files: z.array(
    z.object({
      kind: z.enum(RENDER_FILE_KINDS),
      label: z.string(),
      bytes: z.number().int(),
      width: z.number().int().optional(),
      height: z.number().int().optional(),
    }),
  ),
  finishedAt: z.string().nullable(),
});
export type RenderView = z.infer<typeof renderViewSchema>;

const productionItemSchema = z.object({
  itemId: z.uuid(),
  orderId: z.uuid(),
  orderNumber: z.number().int(),
  buyerName: z.string(),
  label: z.string(),
  quantity: z.number().int(),
  stage: z.enum(ITEM_STAGES),
  thumbUrl: z.string(),
  estimatedBurnSeconds: z.number().nullable(),
});

export const batchSummarySchema = z.object({
  id: z.uuid(),
  number: z.number().int(),
  materialName: z.string(),
  machineName: z.string().nullable(),
  createdAt: z.string(),
  createdBy: z.string(),
  itemCount: z.number().int(),
  rendered: z.number().int(),
  failed: z.number().int(),
  burned: z.number().int(),
});
export type BatchSummary = z.infer<typeof batchSummarySchema>;

/** The production page: approved items grouped by material and machine recipe, and the batches. */
export const productionBoardSchema = z.object({
  groups: z.array(
    z.object({
      key: z.string(),
      materialName: z.string(),
      machineName: z.string().nullable(),
      recipe: z.string().nullable(),
      items: z.array(productionItemSchema),
    }),
  ),
  batches: z.array(batchSummarySchema),
});
export type ProductionBoard = z.infer<typeof productionBoardSchema>;

export const batchViewSchema = batchSummarySchema.extend({
  recipe: z.string().nullable(),
  estimatedBurnSeconds: z.number().nullable(),
  items: z.array(productionItemSchema.extend({ render: renderViewSchema })),
});
export type BatchView = z.infer<typeof batchViewSchema>;

export const downloadLinkSchema = z.object({ url: z.string(), expiresInSeconds: z.number().int(), fileName: z.string() });

/** Handing items over: by carrier with a tracking number, or at the studio. */
export const shipInputSchema = z.discriminatedUnion(
  'method',
  [
    z.object({
      method: z.literal('ship'),
      itemIds: z.array(z.uuid()).min(1, 'Choose the items in the parcel.').max(100),
      carrier: z.string().trim().min(1, 'Name the carrier.').max(60, 'Use at most 60 characters.'),
      trackingNumber: z
        .string()
        .trim()
        .min(3, 'Enter the tracking number.')
        .max(60, 'Use at most 60 characters.')
        .regex(/^[A-Za-z0-9 -]+$/, 'Use letters, digits, spaces and dashes only.'),
    }),
    z.object({ method: z.literal('pickup'), itemIds: z.array(z.uuid()).min(1, 'Choose the items handed over.').max(100) }),
  ],
  { error: 'Choose shipped or picked up.' },
);
export type ShipInput = z.infer<typeof shipInputSchema>;

export const createdBatchSchema = z.object({ id: z.uuid(), number: z.number().int() });
