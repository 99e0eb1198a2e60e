/**
 * Small zod building blocks shared by the library and program forms. Numbers arrive as JSON
 * numbers (the forms convert "" to undefined before validation), so schemas stay transform-free
 * and the same schema types the form and the server.
 */
import { z } from "zod";

export const requiredText = (label: string, max = 120) =>
  z
    .string({ message: `Enter ${label}.` })
    .trim()
    .min(1, { message: `Enter ${label}.` })
    .max(max, { message: `Use at most ${max} characters.` });

export const optionalText = (max = 2000) => z.string().trim().max(max, { message: `Use at most ${max} characters.` }).optional();

export const notes = () => z.string().trim().max(4000, { message: "Use at most 4000 characters." }).default("");

/** A number within [min, max], with a message that names the unit. */
export const measure = (label: string, min: number, max: number, unit: string) =>
  z
    .number({ message: `Enter ${label} in ${unit}.` })
    .refine(Number.isFinite, { message: `Enter ${label} in ${unit}.` })
    .refine((v) => v >= min && v <= max, { message: `${capital(label)} must be between ${min} and ${max} ${unit}.` });

export const optionalMeasure = (label: string, min: number, max: number, unit: string) => measure(label, min, max, unit).nullish();

export const anyNumber = (label: string) => z.number({ message: `Enter ${label}.` }).refine(Number.isFinite, { message: `Enter ${label}.` });

export const wholeNumber = (label: string, min: number, max: number) =>
  z
    .number({ message: `Enter ${label}.` })
    .int({ message: `${capital(label)} must be a whole number.` })
    .min(min, { message: `${capital(label)} must be at least ${min}.` })
    .max(max, { message: `${capital(label)} must be at most ${max}.` });

export const recordId = (label: string) => z.number({ message: `Choose ${label}.` }).int({ message: `Choose ${label}.` }).positive({ message: `Choose ${label}.` });

export const optionalRecordId = () => z.number().int().positive().nullish();

export const calendarDate = (label: string) =>
  z
    .string({ message: `Enter ${label}.` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, { message: `Enter ${label} as YYYY-MM-DD.` })
    .refine((s) => !Number.isNaN(new Date(`${s}T00:00:00Z`).getTime()), { message: `${capital(label)} is not a real date.` });

export const optionalDate = (label: string) => calendarDate(label).nullish();

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
