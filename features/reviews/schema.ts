import { z } from "zod";
import { multilineText, plainText } from "@/features/forms/plain-text";

// Inputs of the review actions. The forms use them for quick feedback; the actions are the authority.
const revisionRef = {
  designId: z.uuid({ error: "Unknown design." }),
  number: z.coerce.number().int().min(1, "Unknown revision."),
};

export const submitRevisionSchema = z.object({
  ...revisionRef,
  /** The version the designer saw; a newer save since then refuses the submit. */
  baseVersion: z.coerce.number().int().min(1).optional(),
});
export type SubmitRevisionInput = z.infer<typeof submitRevisionSchema>;

export const returnRevisionSchema = z.object({
  ...revisionRef,
  comment: multilineText()
    .trim()
    .min(1, "Say what needs to change: a returned revision needs a comment.")
    .max(5000, "Keep the comment under 5000 characters."),
});
export type ReturnRevisionInput = z.infer<typeof returnRevisionSchema>;

export const approveRevisionSchema = z.object({
  ...revisionRef,
  comment: multilineText().trim().max(5000, "Keep the comment under 5000 characters.").default(""),
  /** rule id (features/analysis/rule-groups.ts) → written justification, for every rule with a warn or fail check. */
  justifications: z
    .record(
      plainText().min(1).max(200),
      multilineText().trim().max(5000, "Keep each justification under 5000 characters."),
    )
    .default({}),
  /**
   * The approver has read the result's unverified values (table values from memory) and accepts them;
   * required when there are any. The form's checkbox sends "on", the API `true`.
   */
  acknowledgeUnverifiedValues: z
    .union([z.boolean(), z.literal("on"), z.literal("true"), z.literal("")])
    .default(false)
    .transform((v) => v === true || v === "on" || v === "true"),
});
export type ApproveRevisionInput = z.infer<typeof approveRevisionSchema>;

export const startNewRevisionSchema = z.object(revisionRef);
export type StartNewRevisionInput = z.infer<typeof startNewRevisionSchema>;

export const addCommentSchema = z
  .object({
    ...revisionRef,
    body: multilineText()
      .trim()
      .min(1, "Write a comment first.")
      .max(5000, "Keep the comment under 5000 characters."),
    targetKind: z.enum(["bolt", "check"]).nullable().default(null),
    targetId: plainText().trim().max(200).nullable().default(null),
  })
  .refine((v) => (v.targetKind === null) === (v.targetId === null || v.targetId === ""), {
    error: "Choose what the comment points at, or nothing.",
    path: ["targetId"],
  });
export type AddCommentInput = z.infer<typeof addCommentSchema>;

export const compareRevisionsSchema = z.object({
  from: z.coerce.number().int().min(1, "Choose a revision."),
  to: z.coerce.number().int().min(1, "Choose a revision."),
});
