// Bodies: the small body a team observes, which groups its events. Its physical parameters are the
// dynamics-context document (context-input.ts); here only what names it.

import { z } from 'zod';

import { lineText, TEXT_LIMITS } from './text.js';

export const bodyNameSchema = lineText(TEXT_LIMITS.bodyName, 'body name');
export const bodyDesignationSchema = lineText(TEXT_LIMITS.bodyDesignation, 'designation').nullable();

export const createBodyPayloadSchema = z.strictObject({
  name: bodyNameSchema,
  designation: bodyDesignationSchema.optional(),
});
export type CreateBodyPayload = z.output<typeof createBodyPayloadSchema>;

export const patchBodyPayloadSchema = createBodyPayloadSchema.partial();
export type PatchBodyPayload = z.output<typeof patchBodyPayloadSchema>;

/** How an event names its body: an existing one of the team, or a new one made with the event. */
export const eventBodyChoiceSchema = z.strictObject({
  bodyId: z.string().min(1).max(36).optional(),
  newBody: createBodyPayloadSchema.optional(),
});
