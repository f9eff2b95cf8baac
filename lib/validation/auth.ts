import { z } from "zod";
import "./zod-config";

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter a valid e-mail address."),
  password: z.string().min(1, "Enter your password.").max(200, "That password is too long."),
});
export type SignInInput = z.infer<typeof signInSchema>;
