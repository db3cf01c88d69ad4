import { z } from 'zod';

export const listIdParams = z.object({ id: z.string().regex(/^[1-9]\d{0,9}$/, 'a list id').transform(Number) });

const recipient = z.strictObject({
  address: z.email().max(254),
  displayName: z.string().max(200).regex(/^[^\r\n<>"]*$/, 'no line breaks, angle brackets or quotes').default(''),
});

/** A list as an admin writes it; an edit replaces the whole recipient list. */
export const distributionListBody = z.strictObject({
  name: z.string().min(1).max(100).regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'lowercase letters, digits and single hyphens, e.g. valuation-committee'),
  description: z.string().max(500).default(''),
  recipients: z
    .array(recipient)
    .min(1)
    .max(500)
    .refine((list) => new Set(list.map((r) => r.address.toLowerCase())).size === list.length, 'each address once'),
});

export type DistributionListBody = z.output<typeof distributionListBody>;
