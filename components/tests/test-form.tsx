"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { numberOrNull, numberRequired } from "@/components/decimal";
import { FieldError, FormAlert, applyServerErrors } from "@/components/form-bits";
import type { TestItem } from "@/hooks/api-types";
import { fetchJson } from "@/hooks/use-api";
import { testCreateSchema, type TestCreateInput, type TestUpdateInput } from "@/lib/validation/tests";

type FormInput = z.input<typeof testCreateSchema>;

const FIELDS = [
  "name", "unit", "decimals", "direction", "trialRule", "trialsPerSession", "swcMethod", "swcValue",
  "cvPercent", "typicalError", "typicalErrorDf", "typicalErrorSource", "plausibleMin", "plausibleMax",
] as const;

const numberText = (value: number | null | undefined) => (value === null || value === undefined ? "" : String(value));

function defaultsFor(test: TestItem | null): Record<string, unknown> {
  if (!test) return { decimals: 2, trialRule: "best", trialsPerSession: 3, swcMethod: "sd-factor", swcValue: 0.2 };
  return {
    ...Object.fromEntries(FIELDS.map((f) => [f, test[f]])),
    decimals: numberText(test.decimals),
    trialsPerSession: numberText(test.trialsPerSession),
    swcValue: numberText(test.swcValue),
    cvPercent: numberText(test.cvPercent),
    typicalError: numberText(test.typicalError),
    typicalErrorDf: numberText(test.typicalErrorDf),
    plausibleMin: numberText(test.plausibleMin),
    plausibleMax: numberText(test.plausibleMax),
    typicalErrorSource: test.typicalErrorSource ?? "",
  };
}

/** Create or edit a test of the Test library. Editing sends the version that was read. */
export function TestForm({ test, onDone }: { test: TestItem | null; onDone: (saved: TestItem) => void }) {
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, TestCreateInput>({
    resolver: zodResolver(testCreateSchema),
    defaultValues: defaultsFor(test) as FormInput,
  });
  const method = watch("swcMethod");
  const unit = watch("unit")?.trim();
  const inUnit = unit ? ` (${unit})` : "";

  async function onSubmit(values: TestCreateInput) {
    setFailure(null);
    try {
      const saved = test
        ? await fetchJson<{ test: TestItem }>(`/api/tests/${test.id}`, {
            method: "PATCH",
            body: JSON.stringify({ ...values, version: test.version } satisfies TestUpdateInput),
          })
        : await fetchJson<{ test: TestItem }>("/api/tests", { method: "POST", body: JSON.stringify(values) });
      onDone(saved.test);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  }

  const err = (name: (typeof FIELDS)[number]) => errors[name]?.message as string | undefined;
  const field = (name: (typeof FIELDS)[number]) => ({
    id: `test-${name}`,
    "aria-invalid": err(name) ? true : undefined,
    "aria-describedby": err(name) ? `test-${name}-error` : undefined,
  });
  const num = { setValueAs: numberRequired };
  const optionalNum = { setValueAs: numberOrNull };

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4">
      {test && test.resultCount > 0 && (
        <p className="rounded-md bg-band px-3 py-2 text-sm">
          {test.resultCount} results already use this test. Changing its unit or direction changes how they read.
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr_1fr]">
        <div>
          <label htmlFor="test-name" className="label">Name</label>
          <input className="field" {...field("name")} {...register("name")} />
          <FieldError id="test-name-error" message={err("name")} />
        </div>
        <div>
          <label htmlFor="test-unit" className="label">Unit</label>
          <input className="field" placeholder="cm, s, kg, m" {...field("unit")} {...register("unit")} />
          <FieldError id="test-unit-error" message={err("unit")} />
        </div>
        <div>
          <label htmlFor="test-decimals" className="label">Decimals</label>
          <input className="field num" inputMode="numeric" {...field("decimals")} {...register("decimals", num)} />
          <FieldError id="test-decimals-error" message={err("decimals")} />
        </div>
      </div>

      <fieldset>
        <legend className="label">Direction</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-2">
            <input type="radio" value="higher" {...register("direction")} /> ↑ Higher is better (jumps, distances, loads)
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="lower" {...register("direction")} /> ↓ Lower is better (sprint times)
          </label>
        </div>
        <FieldError message={err("direction")} />
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="test-trialRule" className="label">Trial rule</label>
          <select className="field" {...field("trialRule")} {...register("trialRule")}>
            <option value="best">Best of the trials</option>
            <option value="mean">Mean of the trials</option>
          </select>
          <FieldError id="test-trialRule-error" message={err("trialRule")} />
        </div>
        <div>
          <label htmlFor="test-trialsPerSession" className="label">Trials per session</label>
          <input className="field num" inputMode="numeric" {...field("trialsPerSession")} {...register("trialsPerSession", num)} />
          <FieldError id="test-trialsPerSession-error" message={err("trialsPerSession")} />
        </div>
      </div>

      <div className="grid gap-4 sm:grid-cols-[1.6fr_1fr_1fr]">
        <div>
          <label htmlFor="test-swcMethod" className="label">Smallest worthwhile change</label>
          <select className="field" {...field("swcMethod")} {...register("swcMethod")}>
            <option value="sd-factor">Factor × between-athlete SD</option>
            <option value="fixed">Fixed value in the unit</option>
            <option value="cv-factor">Factor × CV%</option>
          </select>
        </div>
        <div>
          <label htmlFor="test-swcValue" className="label">{method === "fixed" ? `SWC${inUnit}` : "Factor"}</label>
          <input className="field num" inputMode="decimal" {...field("swcValue")} {...register("swcValue", num)} />
          <FieldError id="test-swcValue-error" message={err("swcValue")} />
        </div>
        <div>
          <label htmlFor="test-cvPercent" className="label">CV% {method === "cv-factor" ? "" : "(optional)"}</label>
          <input className="field num" inputMode="decimal" {...field("cvPercent")} {...register("cvPercent", optionalNum)} />
          <FieldError id="test-cvPercent-error" message={err("cvPercent")} />
        </div>
      </div>

      <div className="grid gap-4 sm:grid-cols-[1fr_1fr_2fr]">
        <div>
          <label htmlFor="test-typicalError" className="label">Typical error{inUnit}</label>
          <input className="field num" inputMode="decimal" {...field("typicalError")} {...register("typicalError", optionalNum)} />
          <FieldError id="test-typicalError-error" message={err("typicalError")} />
        </div>
        <div>
          <label htmlFor="test-typicalErrorDf" className="label">Its df</label>
          <input className="field num" inputMode="numeric" {...field("typicalErrorDf")} {...register("typicalErrorDf", optionalNum)} />
          <FieldError id="test-typicalErrorDf-error" message={err("typicalErrorDf")} />
        </div>
        <div>
          <label htmlFor="test-typicalErrorSource" className="label">Source of the typical error</label>
          <input className="field" placeholder="e.g. club test–retest, August" {...field("typicalErrorSource")} {...register("typicalErrorSource")} />
          <FieldError id="test-typicalErrorSource-error" message={err("typicalErrorSource")} />
        </div>
      </div>

      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="test-plausibleMin" className="label">Lowest plausible score{inUnit}</label>
          <input className="field num" inputMode="decimal" {...field("plausibleMin")} {...register("plausibleMin", optionalNum)} />
          <FieldError id="test-plausibleMin-error" message={err("plausibleMin")} />
        </div>
        <div>
          <label htmlFor="test-plausibleMax" className="label">Highest plausible score{inUnit}</label>
          <input className="field num" inputMode="decimal" {...field("plausibleMax")} {...register("plausibleMax", optionalNum)} />
          <FieldError id="test-plausibleMax-error" message={err("plausibleMax")} />
        </div>
      </div>
      <p className="text-xs text-ink-faint">
        Scores outside the plausible range are still accepted on the Session sheet, but they are marked for a second look.
      </p>

      <FormAlert message={failure} />
      <div className="flex justify-end gap-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : test ? "Save changes" : "Add test"}
        </button>
      </div>
    </form>
  );
}
