import { z } from 'zod';

/**
 * Browsers upload images straight to object storage with a presigned PUT: the app first hands
 * out a ticket for one object of a declared type and length, and later claims it by key.
 */
export const IMAGE_UPLOAD_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const MAX_IMAGE_UPLOAD_BYTES = 25 * 1024 * 1024;

export const imageUploadRequestSchema = z.object({
  contentType: z.enum(IMAGE_UPLOAD_TYPES, { error: 'Upload a JPEG, PNG or WebP image.' }),
  contentLength: z
    .number({ error: 'Say how large the file is.' })
    .int()
    .positive('This file is empty.')
    .max(MAX_IMAGE_UPLOAD_BYTES, `This file is larger than ${MAX_IMAGE_UPLOAD_BYTES / 1024 / 1024} MB.`),
});
export type ImageUploadRequest = z.infer<typeof imageUploadRequestSchema>;

export const uploadTicketSchema = z.object({
  key: z.string(),
  url: z.string(),
  /** Headers the PUT must carry exactly: they are part of the signature. */
  headers: z.record(z.string(), z.string()),
});
export type UploadTicket = z.infer<typeof uploadTicketSchema>;

export const claimUploadSchema = z.object({ key: z.string().min(1, 'Name the uploaded file.').max(300) });
