import { useState } from 'react';
import { judgeStep, TEST_PHASE_INFO } from '#shared/domain/test-plan.ts';
import {
  TEST_PHASES,
  type TestPlanResponse,
  type TestStep,
  type TestVerdict,
} from '#shared/schemas/test-plan.schema.ts';
import { Notice } from '@/components/ui/notice.tsx';
import { useRecordBenchWork } from '../api/bench.ts';
import { NoteField, parseReading, Toggle } from './bench-controls.tsx';

interface Local {
  ticks: Record<string, boolean | undefined>;
  reading: number | null;
  note: string;
  version: number | null;
}

const VERDICT: Record<TestVerdict, { word: string; glyph: string; className: string }> = {
  pass: { word: 'Pass', glyph: '✓', className: 'border-sound bg-sound-wash text-sound' },
  fail: { word: 'Fail', glyph: '✕', className: 'border-fault bg-fault-wash text-fault' },
  unknown: { word: 'Not yet', glyph: '–', className: 'border-rule text-ink-faint' },
};

function Verdict({ verdict }: { verdict: TestVerdict }) {
  const v = VERDICT[verdict];
  return (
    <span
      role="status"
      aria-label={`Verdict: ${v.word}`}
      className={`inline-flex min-w-20 items-center justify-center gap-1 rounded border-2 px-2 py-1 font-semibold ${v.className}`}
    >
      <span aria-hidden>{v.glyph}</span> {v.word}
    </span>
  );
}

function StepRow({
  step,
  local,
  batteryV,
  canRecord,
  onSave,
}: {
  step: TestStep;
  local: Local;
  batteryV: number | null;
  canRecord: boolean;
  onSave: (next: Local) => void;
}) {
  const [text, setText] = useState(local.reading == null ? '' : String(local.reading));
  const [error, setError] = useState<string | null>(null);
  const verdict = judgeStep(
    step,
    { reading: local.reading, passed: local.ticks.passed, failed: local.ticks.failed },
    batteryV,
  );
  function saveReading() {
    const value = parseReading(text);
    if (value !== null && !Number.isFinite(value)) {
      setError(`Enter the reading in ${step.unit}`);
      return;
    }
    setError(null);
    if (value === local.reading) return;
    const isWire = !step.key.startsWith('test:');
    onSave({
      ...local,
      reading: value,
      ticks: isWire
        ? { ...local.ticks, tested: value !== null || local.ticks.tested }
        : local.ticks,
    });
  }
  return (
    <li className="rounded-lg border border-rule bg-paper-raised p-4" data-step={step.key}>
      <div className="flex flex-wrap items-start gap-x-6 gap-y-3">
        <div className="min-w-56 flex-1">
          <p className="font-mono text-lg font-bold">{step.subject}</p>
          <p className="text-lg">{step.what}</p>
          <p className="mt-1 text-sm text-ink-soft">
            {step.expectedText ? <>Expected {step.expectedText} · </> : null}
            {step.limitText ? <>Pass: {step.limitText}</> : null}
          </p>
          <p className="text-xs text-ink-faint">Source: {step.source}</p>
        </div>
        <div className="flex flex-wrap items-end gap-3">
          {step.unit === 'check' ? (
            <>
              <Toggle
                label="Pass"
                on={local.ticks.passed === true}
                disabled={!canRecord}
                onChange={(on) => onSave({ ...local, ticks: { passed: on, failed: false } })}
              />
              <Toggle
                label="Fail"
                tone="fault"
                on={local.ticks.failed === true}
                disabled={!canRecord}
                onChange={(on) => onSave({ ...local, ticks: { passed: false, failed: on } })}
              />
            </>
          ) : (
            <label className="flex flex-col text-sm font-medium text-ink-soft">
              Reading, {step.unit}
              <input
                inputMode="decimal"
                className="mt-1 h-12 w-28 rounded-md border-2 border-rule-strong bg-paper px-3 font-mono text-lg text-ink aria-[invalid=true]:border-fault"
                value={text}
                disabled={!canRecord}
                aria-invalid={error || verdict === 'fail' ? true : undefined}
                onChange={(e) => setText(e.target.value)}
                onBlur={saveReading}
                onKeyDown={(e) => e.key === 'Enter' && saveReading()}
              />
            </label>
          )}
          <Verdict verdict={verdict} />
        </div>
      </div>
      {error ? <p className="mt-2 text-sm text-fault">{error}</p> : null}
      {step.limit?.withinOfBatteryV != null && batteryV == null && local.reading != null ? (
        <p className="mt-2 text-sm text-caution">Record the battery voltage to judge this one.</p>
      ) : null}
      {verdict === 'fail' ? (
        <NoteField
          note={local.note}
          disabled={!canRecord}
          onSave={(note) => onSave({ ...local, note })}
        />
      ) : null}
    </li>
  );
}

/** The generated test plan on the tablet: each reading typed with its unit and judged at once. */
export function TestPlanView({
  conversionId,
  data,
  canRecord,
}: {
  conversionId: number;
  data: TestPlanResponse;
  canRecord: boolean;
}) {
  const record = useRecordBenchWork(conversionId);
  const writable = canRecord && data.revision.current;
  const [values, setValues] = useState<Record<string, Local>>(() =>
    Object.fromEntries(
      Object.entries(data.results).map(([key, r]) => [
        key,
        { ticks: r.ticks, reading: r.reading, note: r.note, version: r.version },
      ]),
    ),
  );
  const empty: Local = { ticks: {}, reading: null, note: '', version: null };
  const batteryV = values['test:battery']?.reading ?? null;
  const save = (step: TestStep, next: Local) => {
    setValues((v) => ({ ...v, [step.key]: next }));
    record.mutate({
      conversionId,
      revisionNumber: data.revision.number,
      key: step.key,
      name: `${step.subject}: ${step.what}`,
      change: { ticks: next.ticks, reading: next.reading, note: next.note },
      baseVersion: values[step.key]?.version ?? null,
    });
  };
  const counts = data.plan.steps.reduce(
    (acc, s) => {
      const l = values[s.key] ?? empty;
      acc[judgeStep(s, { reading: l.reading, ...l.ticks }, batteryV)] += 1;
      return acc;
    },
    { pass: 0, fail: 0, unknown: 0 } as Record<TestVerdict, number>,
  );
  return (
    <div className="flex flex-col gap-6">
      <p className="font-semibold" role="status">
        {counts.pass} passed · {counts.fail} failed · {counts.unknown} still to test
      </p>
      {TEST_PHASES.map((phase) => {
        const steps = data.plan.steps.filter((s) => s.phase === phase);
        if (!steps.length) return null;
        return (
          <section key={phase} aria-labelledby={`phase-${phase}`} className="flex flex-col gap-3">
            <h3 id={`phase-${phase}`} className="text-lg font-semibold">
              {TEST_PHASE_INFO[phase].title}
            </h3>
            <Notice tone="caution">{TEST_PHASE_INFO[phase].caution}</Notice>
            <ol className="flex flex-col gap-3">
              {steps.map((step) => (
                <StepRow
                  key={step.key}
                  step={step}
                  local={values[step.key] ?? empty}
                  batteryV={batteryV}
                  canRecord={writable}
                  onSave={(next) => save(step, next)}
                />
              ))}
            </ol>
          </section>
        );
      })}
    </div>
  );
}
