"use client";

import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { HEAD_SOURCES } from "@/db/enums";
import { HEAD_SOURCE_LABEL, type HeadSource } from "@/lib/jobs/words";
import { Field, inputClass } from "../ui/Field";

export type HeadFieldValues = { serial: string; castingNumber: string; source: HeadSource; incomingNotes: string };

/** The fields a head is received and corrected with; shared by the two head forms. */
export function HeadFields({
  register,
  errors,
  idPrefix,
  serialLabel,
  notesHint,
}: {
  register: UseFormRegister<HeadFieldValues>;
  errors: FieldErrors<HeadFieldValues>;
  idPrefix: string;
  serialLabel: string;
  notesHint?: string;
}) {
  const id = (f: string) => `${idPrefix}-${f}`;
  return (
    <>
      <Field label={serialLabel} htmlFor={id("serial")} error={errors.serial?.message}>
        <input id={id("serial")} className={inputClass(!!errors.serial)} {...register("serial")} />
      </Field>
      <Field label="Casting number" htmlFor={id("casting")} error={errors.castingNumber?.message}>
        <input id={id("casting")} className={inputClass(!!errors.castingNumber)} {...register("castingNumber")} />
      </Field>
      <Field label="Source" htmlFor={id("source")} error={errors.source?.message}>
        <select id={id("source")} className={inputClass(!!errors.source)} {...register("source")}>
          {HEAD_SOURCES.map((s) => (
            <option key={s} value={s}>
              {HEAD_SOURCE_LABEL[s]}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Incoming inspection" htmlFor={id("notes")} error={errors.incomingNotes?.message} hint={notesHint}>
        <textarea id={id("notes")} rows={3} className={inputClass(!!errors.incomingNotes)} {...register("incomingNotes")} />
      </Field>
    </>
  );
}
