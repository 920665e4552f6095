"use client";
// Logging a test run (or changing one): the revision tested, date, part, material from the shelf, the set-up
// as tested (motor, gearing, lock, load), what happened and where, notes, and photos. The run is written
// first, then each photo is sent on its own (with its progress); a photo the server refuses is named with
// the reason, and the run stays logged.
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { ModalDialog } from "@/components/ui/modal-dialog";
import { ErrorNotice } from "@/components/ui/notice";
import { ACCEPTED_IMAGE_TYPES, ACCEPTED_IMAGE_WORDS, formatBytes, type AttachmentInfo } from "@/contracts/attachments";
import type { Layout } from "@/contracts/layout";
import type { ShelfItem } from "@/contracts/shelf";
import { OUTCOME_LABELS, parseGearRatios, TEST_OUTCOMES, type TestOutcome, type TestRun } from "@/contracts/test-log";
import { api, ApiError, uploadFile } from "@/lib/api-client";

/** The server's default upload limit (KB_MAX_UPLOAD_BYTES): larger files are stopped here before sending. */
export const UPLOAD_LIMIT_BYTES = 10_485_760;

type Fields = {
  revision: string;
  testedOn: string;
  part: string;
  materialId: string;
  motorKind: "kv" | "torque";
  kv: string;
  current: string;
  torque: string;
  gearing: string;
  lock: string;
  load: string;
  outcome: TestOutcome;
  failureLocation: string;
  notes: string;
};

const today = () => new Date().toISOString().slice(0, 10);

/** The material a run most likely used: the layout's linked shelf material, else the shelf's copy of its catalogue material. */
function defaultMaterial(layout: Layout, materials: readonly ShelfItem[]): string {
  const linked = layout.shelf?.material;
  if (linked && materials.some((m) => m.id === linked)) return linked;
  const m = layout.strength.material;
  const fromCatalogue = m.kind === "catalogue" ? materials.find((i) => i.catalogueId === m.id) : materials.find((i) => i.name === m.name);
  return fromCatalogue?.id ?? materials[0]?.id ?? "";
}

function fieldsFor(run: TestRun | null, layout: Layout, revision: number, materials: readonly ShelfItem[]): Fields {
  const motor = run?.setup.motor ?? layout.strength.motor;
  const ratios = run?.setup.gearRatios ?? layout.strength.gearRatios;
  return {
    revision: String(run?.revision ?? revision),
    testedOn: run?.testedOn ?? today(),
    part: run?.part ?? "",
    materialId: run?.materialId ?? defaultMaterial(layout, materials),
    motorKind: motor.kind,
    kv: motor.kind === "kv" ? String(motor.kvRpmPerV) : "",
    current: motor.kind === "kv" ? String(motor.currentA) : "",
    torque: motor.kind === "torque" ? String(motor.torqueNm) : "",
    gearing: ratios.map((r) => Number(r.toFixed(4))).join(" × "),
    lock: run?.setup.lockDeg == null ? "" : String(run.setup.lockDeg),
    load: run?.setup.load ?? "",
    outcome: run?.outcome ?? "held",
    failureLocation: run?.failureLocation ?? "",
    notes: run?.notes ?? "",
  };
}

const num = (t: string) => (t.trim() === "" ? Number.NaN : Number(t));

/** The body for the API, or the field errors found before sending (same paths as the server's). */
function bodyOf(f: Fields): { body: Record<string, unknown> } | { errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const ratios = parseGearRatios(f.gearing);
  if (!ratios) errors["setup.gearRatios"] = "Enter the stage ratios as numbers, e.g. 3.45 × 2.6";
  const lock = f.lock.trim() === "" ? null : num(f.lock);
  if (lock !== null && !Number.isFinite(lock)) errors["setup.lockDeg"] = "Enter the lock in degrees, or leave it empty";
  const motor = f.motorKind === "kv" ? { kind: "kv", kvRpmPerV: num(f.kv), currentA: num(f.current) } : { kind: "torque", torqueNm: num(f.torque) };
  for (const [k, v] of Object.entries(motor)) if (k !== "kind" && !Number.isFinite(v)) errors[`setup.motor.${k}`] = "Enter a number";
  if (Object.keys(errors).length) return { errors };
  return {
    body: {
      revision: Number(f.revision),
      testedOn: f.testedOn,
      part: f.part,
      materialId: f.materialId,
      setup: { motor, gearRatios: ratios, lockDeg: lock, load: f.load },
      outcome: f.outcome,
      failureLocation: f.failureLocation,
      notes: f.notes,
    },
  };
}

export interface RunFormProps {
  readonly open: boolean;
  readonly onClose: () => void;
  readonly onSaved: () => void;
  readonly workspaceId: string;
  readonly kitId: string;
  readonly layout: Layout;
  readonly revisions: readonly number[];
  readonly revision: number;
  readonly materials: readonly ShelfItem[];
  /** The run to change; null to log a new one. */
  readonly run: TestRun | null;
}

export function RunForm(props: RunFormProps) {
  return (
    <ModalDialog open={props.open} title={props.run ? `Change run ${props.run.number}` : "Log a test run"} onClose={props.onClose} testId="run-form">
      {props.open ? <RunFormBody {...props} /> : null}
    </ModalDialog>
  );
}

function RunFormBody({ onClose, onSaved, workspaceId, kitId, layout, revisions, revision, materials, run }: RunFormProps) {
  const id = useId();
  const [f, setF] = useState<Fields>(() => fieldsFor(run, layout, revision, materials));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [files, setFiles] = useState<File[]>([]);
  const [busy, setBusy] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [photoProblems, setPhotoProblems] = useState<string[]>([]);
  const set = <K extends keyof Fields>(k: K) => (e: { target: { value: string } }) => setF((cur) => ({ ...cur, [k]: e.target.value as Fields[K] }));
  const err = (path: string) => errors[path];
  const base = `/api/workspaces/${workspaceId}/kits/${kitId}/test-runs`;

  const tooBig = files.filter((file) => file.size > UPLOAD_LIMIT_BYTES);
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setFailure(null);
    setPhotoProblems([]);
    const built = bodyOf(f);
    if ("errors" in built) {
      setErrors(built.errors);
      return;
    }
    if (tooBig.length) return;
    setErrors({});
    setBusy(run ? "Saving the run…" : "Logging the run…");
    let saved: TestRun;
    try {
      if (run) {
        const { revision: _r, ...changes } = built.body;
        void _r;
        saved = (await api<{ run: TestRun }>(`${base}/${run.id}`, { method: "PATCH", body: { version: run.version, ...changes } })).run;
      } else {
        saved = (await api<{ run: TestRun }>(base, { method: "POST", body: built.body })).run;
      }
    } catch (error) {
      setBusy(null);
      if (error instanceof ApiError && error.fields.length) setErrors(Object.fromEntries(error.fields.map((x) => [x.path, x.message])));
      setFailure(error instanceof Error ? error.message : String(error));
      return;
    }
    const problems: string[] = [];
    for (const [i, file] of files.entries()) {
      setBusy(`Sending photo ${i + 1} of ${files.length} (${file.name}, ${formatBytes(file.size)})…`);
      try {
        await uploadFile<{ photo: AttachmentInfo }>(`${base}/${saved.id}/photos`, file);
      } catch (error) {
        problems.push(`${file.name}: ${error instanceof Error ? error.message : String(error)}`);
      }
    }
    setBusy(null);
    onSaved();
    if (problems.length) {
      setPhotoProblems(problems);
      setFiles([]);
      return;
    }
    onClose();
  };

  if (photoProblems.length) {
    return (
      <div className="flex flex-col gap-3">
        <ErrorNotice title={`The run is logged, but ${photoProblems.length === 1 ? "a photo was" : "some photos were"} not kept`} message={photoProblems.join(" ")} />
        <div className="flex justify-end"><Button onClick={onClose}>Close</Button></div>
      </div>
    );
  }

  return (
    <form className="flex max-h-[70vh] flex-col gap-3 overflow-y-auto pr-1" onSubmit={submit} noValidate>
      <div className="grid grid-cols-2 gap-2">
        <SelectField id={`${id}-rev`} label="Revision tested" value={f.revision} onChange={set("revision")} error={err("revision")} disabled={!!run}>
          {revisions.map((n) => <option key={n} value={n}>Revision {n}</option>)}
        </SelectField>
        <TextField id={`${id}-date`} label="Tested on" type="date" value={f.testedOn} onChange={set("testedOn")} error={err("testedOn")} max={today()} required />
      </div>
      <TextField id={`${id}-part`} label="Part" value={f.part} onChange={set("part")} error={err("part")} placeholder="left front dogbone" maxLength={120} required />
      <SelectField id={`${id}-material`} label="Material" value={f.materialId} onChange={set("materialId")} error={err("materialId")} hint="From the workspace shelf: what the part was made of.">
        {materials.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
      </SelectField>
      <fieldset className="flex flex-col gap-2 rounded border border-ink/10 p-2">
        <legend className="px-1 text-sm font-medium text-ink/80">Set-up as tested</legend>
        <SelectField id={`${id}-motor`} label="Motor figure" value={f.motorKind} onChange={set("motorKind")}>
          <option value="kv">Kv rating and current</option>
          <option value="torque">Torque</option>
        </SelectField>
        {f.motorKind === "kv" ? (
          <div className="grid grid-cols-2 gap-2">
            <TextField id={`${id}-kv`} label="Kv (rpm/V)" inputMode="decimal" value={f.kv} onChange={set("kv")} error={err("setup.motor.kvRpmPerV")} />
            <TextField id={`${id}-current`} label="Current (A)" inputMode="decimal" value={f.current} onChange={set("current")} error={err("setup.motor.currentA")} />
          </div>
        ) : (
          <TextField id={`${id}-torque`} label="Motor torque (N·m)" inputMode="decimal" value={f.torque} onChange={set("torque")} error={err("setup.motor.torqueNm")} />
        )}
        <TextField id={`${id}-gearing`} label="Gear ratios" value={f.gearing} onChange={set("gearing")} error={err("setup.gearRatios")} hint="Each stage driven/driving, e.g. 3.45 × 2.6" />
        <div className="grid grid-cols-2 gap-2">
          <TextField id={`${id}-lock`} label="Steer lock (°)" inputMode="decimal" value={f.lock} onChange={set("lock")} error={err("setup.lockDeg")} hint="Optional" />
          <TextField id={`${id}-load`} label="Load" value={f.load} onChange={set("load")} error={err("setup.load")} placeholder="1.6 kg car, 20 laps" maxLength={200} />
        </div>
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-medium text-ink/80">Outcome</legend>
        <div className="flex gap-4">
          {TEST_OUTCOMES.map((o) => (
            <label key={o} className="flex items-center gap-1.5 text-sm">
              <input type="radio" name={`${id}-outcome`} value={o} checked={f.outcome === o} onChange={() => setF((cur) => ({ ...cur, outcome: o }))} />
              {OUTCOME_LABELS[o]}
            </label>
          ))}
        </div>
      </fieldset>
      {f.outcome !== "held" ? (
        <TextField id={`${id}-where`} label={f.outcome === "broke" ? "Where it broke" : "Where it wore"} value={f.failureLocation} onChange={set("failureLocation")} error={err("failureLocation")} placeholder="neck, 2 mm from the ball" maxLength={200} required={f.outcome === "broke"} />
      ) : null}
      <TextAreaField id={`${id}-notes`} label="Notes" value={f.notes} onChange={set("notes")} error={err("notes")} maxLength={2000} />
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-photos`} className="text-sm font-medium text-ink/80">{run ? "Add photos" : "Photos"}</label>
        <input
          id={`${id}-photos`}
          type="file"
          multiple
          accept={Object.keys(ACCEPTED_IMAGE_TYPES).join(",")}
          onChange={(e) => setFiles([...(e.target.files ?? [])])}
          aria-describedby={`${id}-photos-hint`}
          className="text-sm file:mr-2 file:rounded file:border file:border-ink/20 file:bg-white file:px-2 file:py-1"
        />
        <p id={`${id}-photos-hint`} className="text-xs text-ink-muted">{`${ACCEPTED_IMAGE_WORDS[0]!.toUpperCase()}${ACCEPTED_IMAGE_WORDS.slice(1)}, up to ${formatBytes(UPLOAD_LIMIT_BYTES)} each.`}</p>
        {tooBig.length ? <p role="alert" className="text-xs text-red-700">{tooBig.map((t) => `${t.name} is ${formatBytes(t.size)}`).join("; ")}: larger than {formatBytes(UPLOAD_LIMIT_BYTES)}. Scale it down or pick another.</p> : null}
      </div>
      {failure ? <ErrorNotice title={run ? "Not saved" : "Not logged"} message={failure} /> : null}
      {busy ? <p role="status" className="text-sm text-ink-muted">{busy}</p> : null}
      <div className="flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onClose} disabled={!!busy}>Cancel</Button>
        <Button type="submit" busy={!!busy}>{run ? "Save the run" : "Log the run"}</Button>
      </div>
    </form>
  );
}
