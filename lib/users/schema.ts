/** Shapes of the user-administration inputs, shared by the forms and the server. */
import { z } from "zod";
import { ROLES } from "@/db/enums";
export const PASSWORD_MIN = 10;

export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: "Enter a valid e-mail address." }));

export const passwordField = z
  .string()
  .min(PASSWORD_MIN, { message: `Use at least ${PASSWORD_MIN} characters.` })
  .max(200, { message: "Use at most 200 characters." });

export const inviteSchema = z.object({
  email: emailField,
  role: z.enum(ROLES, { message: "Choose a role." }),
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const setPasswordSchema = z
  .object({
    token: z.string().min(10, { message: "The link is incomplete." }),
    name: z.string().trim().min(2, { message: "Enter your name." }).max(100).optional(),
    password: passwordField,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });
export type SetPasswordInput = z.infer<typeof setPasswordSchema>;

export const forgotSchema = z.object({ email: emailField });

export const updateUserSchema = z
  .object({
    role: z.enum(ROLES).optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: "Nothing to change." });
export type UpdateUserInput = z.infer<typeof updateUserSchema>;
