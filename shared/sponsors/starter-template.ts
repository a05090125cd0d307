import { suggestedTemplateItems, type TemplateItem } from "./deliverables";

/**
 * The deal template a new channel starts with: the usual run of a sponsored segment, from the
 * script to the payment, counted from the publish date and go-live. The offsets are Kerf's own
 * workable defaults (common practice, not from a published source); each channel edits them.
 */
export const starterTemplate: { name: string; items: TemplateItem[] } = {
  name: "Sponsored segment (starter: edit to suit)",
  items: suggestedTemplateItems,
};
