import { z } from "zod";
import { ROLES } from "@/lib/domain";
import { idSchema, optionalText, requiredText } from "./common";
import "./zod-config";

const email = z
  .string("Enter an e-mail address.")
  .trim()
  .toLowerCase()
  .max(254, "That e-mail address is too long.")
  .email("Enter a valid e-mail address.");

/** Long enough to resist guessing, short enough for bcrypt (which reads at most 72 bytes). */
export const newPassword = z
  .string("Choose a password.")
  .min(10, "Use at least 10 characters.")
  .max(72, "Use at most 72 characters.")
  .refine((v) => new TextEncoder().encode(v).length <= 72, "Use at most 72 bytes (fewer for accented letters).");

const role = z.enum(ROLES, "Choose one of the roles: owner, scientist, coach or athlete.");

/** An invitation: staff roles by address alone; an athlete's names the athlete record it claims. */
export const invitationCreateSchema = z
  .object({ email, role, athleteId: idSchema.nullish() })
  .superRefine((value, ctx) => {
    if (value.role === "athlete" && !value.athleteId)
      ctx.addIssue({ code: "custom", path: ["athleteId"], message: "Choose the athlete this account belongs to." });
    if (value.role !== "athlete" && value.athleteId)
      ctx.addIssue({ code: "custom", path: ["athleteId"], message: "Only athlete invitations name an athlete." });
  });
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;

/** A one-time token from a mailed link: base64url of 32 bytes (43 characters). */
export const tokenSchema = z
  .string("The link is incomplete.")
  .regex(/^[A-Za-z0-9_-]{43}$/, "This link is not complete. Open it again from the mail.");

/**
 * What the invitee types on the accept page. The name is asked only of someone new to Changewise;
 * a person who already signs in elsewhere keeps their name and confirms with their password.
 */
export const invitationAcceptFields = z.object({
  name: requiredText(120, "Your name").optional(),
  password: newPassword,
});
export const invitationAcceptSchema = invitationAcceptFields.extend({ token: tokenSchema });
export type InvitationAcceptInput = z.infer<typeof invitationAcceptSchema>;

export const passwordResetRequestSchema = z.object({ email });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetFields = z.object({ password: newPassword });
export const passwordResetConfirmSchema = passwordResetFields.extend({ token: tokenSchema });
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>;

export const memberUpdateSchema = z.object({ role });
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>;

export const deletionRequestSchema = z.object({
  message: optionalText(1000, "Your message", { multiline: true }),
});
export type DeletionRequestInput = z.infer<typeof deletionRequestSchema>;
