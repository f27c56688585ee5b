import type { ReactNode } from 'react';
import { DISPOSITION_INFO, DISPOSITIONS } from '#shared/domain/dispositions.ts';
import {
  SIGNAL_CLASS_LABELS,
  SIGNAL_CLASSES,
  type SignalClass,
} from '#shared/domain/signal-classes.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';
import readme from '../../../../README.md?raw';
import {
  firstTable,
  inline,
  numberedItems,
  paragraphs,
  section,
  type Inline,
  type Table,
} from '../lib/readme.ts';

/** What each signal class means to the builder and to the checks. */
const SIGNAL_CLASS_MEANING: Record<SignalClass, string> = {
  power_feed:
    'Supply into the ECU or a device. Joined to the vehicle, it must have a fuse upstream.',
  power_ground: 'The ECU’s or a device’s main ground, carrying load current back to the battery.',
  sensor_ground:
    'The ECU’s own clean return for its sensors. It is not grounded anywhere else: the checks warn on an extra ground.',
  sensor_signal: 'A sensor’s reading into the ECU (temperature, pressure, position, speed).',
  sensor_reference: 'The regulated supply the ECU gives its sensors, usually 5 V.',
  actuator_output: 'The ECU switching a load: an injector, a coil, a valve, a relay coil.',
  switched_input: 'A switch or request into the ECU (brake, clutch, A/C request, ignition sense).',
  communication: 'A data line, such as a CAN pair or a diagnostic line.',
  output_signal: 'A signal the ECU sends to another module or gauge (tachometer, speed out).',
  shield: 'A cable screen or drain wire, grounded at one end only.',
  none: 'Not set yet.',
};

function Text({ parts }: { parts: Inline[] }) {
  return (
    <>
      {parts.map((p, i) =>
        p.kind === 'strong' ? (
          <strong key={i}>{p.text}</strong>
        ) : p.kind === 'code' ? (
          <code key={i} className="rounded bg-paper-sunk px-1 font-mono text-[0.875em]">
            {p.text}
          </code>
        ) : p.kind === 'link' && /^https?:/.test(p.href) ? (
          <a key={i} href={p.href} className="underline" rel="noopener noreferrer">
            {p.text}
          </a>
        ) : (
          // Links into the repository's docs are not served by the app: their words stand.
          <span key={i}>{p.text}</span>
        ),
      )}
    </>
  );
}

const md = (text: string) => <Text parts={inline(text)} />;

function MarkdownTable({ table, caption }: { table: Table; caption: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised">
      <table className="lw-table w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule bg-paper-sunk/60">
          <tr>
            {table.head.map((h, i) => (
              <th key={i} scope="col" className="px-3 py-2 text-left">
                {md(h)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {table.rows.map((row, r) => (
            <tr key={r} className="border-b border-rule/60 align-top last:border-0">
              {row.map((cell, c) =>
                c === 0 ? (
                  <th key={c} scope="row" className="px-3 py-2 text-left font-normal">
                    {md(cell)}
                  </th>
                ) : (
                  <td key={c} className="px-3 py-2">
                    {md(cell)}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="flex scroll-mt-6 flex-col gap-3">
      <h2 id={`${id}-heading`} className="text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

export interface HelpShortcut {
  keys: string[];
  does: string;
  writes?: boolean;
}

const CONTENTS = [
  ['tour', 'A tour'],
  ['keys', 'Keyboard shortcuts'],
  ['dispositions', 'Dispositions'],
  ['signal-classes', 'Signal classes'],
  ['rules', 'What the checks check'],
  ['roles', 'Who may do what'],
] as const;

/**
 * Everything a new builder needs without the README: the tour and the tables of rules and rights
 * read from the README itself, the pin grid's keys, and what each disposition and signal class
 * means.
 */
export function HelpScreen({ shortcuts }: { shortcuts: readonly HelpShortcut[] }) {
  const intro = paragraphs(section(readme, 'A tour'));
  const tour = numberedItems(section(readme, 'A tour'));
  const rulesText = section(readme, 'What the checks check, and on what authority');
  const rules = firstTable(rulesText);
  const rulesNotes = paragraphs(rulesText);
  const roles = firstTable(section(readme, 'Who may do what'));

  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <nav aria-label="On this page" className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        {CONTENTS.map(([id, title]) => (
          <a
            key={id}
            href={`#${id}`}
            className="underline decoration-rule-strong underline-offset-4"
          >
            {title}
          </a>
        ))}
      </nav>

      <Section id="tour" title="A tour">
        {intro.map((p, i) => (
          <p key={i}>{md(p)}</p>
        ))}
        <ol className="flex list-decimal flex-col gap-2 pl-6">
          {tour.map((item, i) => (
            <li key={i} className="leading-relaxed">
              {md(item)}
            </li>
          ))}
        </ol>
      </Section>

      <Section id="keys" title="Keyboard shortcuts in the pin grid">
        <p className="text-ink-soft">
          On a Mac, Cmd stands for Ctrl. Keys marked “edit” are for those who may change the pin
          map.
        </p>
        <table className="lw-table w-full border-collapse text-sm">
          <caption className="sr-only">Keyboard shortcuts of the pin grid</caption>
          <thead className="border-b border-rule">
            <tr>
              <th scope="col" className="px-3 py-2 text-left">
                Keys
              </th>
              <th scope="col" className="px-3 py-2 text-left">
                What they do
              </th>
            </tr>
          </thead>
          <tbody>
            {shortcuts.map((s) => (
              <tr key={s.does} className="border-b border-rule/60 align-top">
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  {s.keys.map((k, i) => (
                    <span key={k}>
                      {i ? ' or ' : ''}
                      <kbd className="rounded border border-rule-strong bg-paper-raised px-1 font-mono text-[0.8125rem]">
                        {k}
                      </kbd>
                    </span>
                  ))}
                </th>
                <td className="px-3 py-2">
                  {s.does}
                  {s.writes ? <span className="ml-2 text-xs text-ink-faint">edit</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      <Section id="dispositions" title="Dispositions: what happens to each pin">
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
          {DISPOSITIONS.map((d) => (
            <div key={d} className="contents">
              <dt className="flex items-center gap-2 font-semibold">
                <DispositionGlyph disposition={d} />
                {DISPOSITION_INFO[d].label}
              </dt>
              <dd className="text-ink-soft">{DISPOSITION_INFO[d].description}</dd>
            </div>
          ))}
        </dl>
      </Section>

      <Section id="signal-classes" title="Signal classes: what each pin carries">
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
          {SIGNAL_CLASSES.map((s) => (
            <div key={s} className="contents">
              <dt className="font-semibold">{SIGNAL_CLASS_LABELS[s]}</dt>
              <dd className="text-ink-soft">{SIGNAL_CLASS_MEANING[s]}</dd>
            </div>
          ))}
        </dl>
      </Section>

      <Section id="rules" title="What the checks check, and on what authority">
        {rules ? (
          <MarkdownTable table={rules} caption="Check rules with severity and source" />
        ) : null}
        {rulesNotes.map((p, i) => (
          <p key={i} className="text-sm text-ink-soft">
            {md(p)}
          </p>
        ))}
      </Section>

      <Section id="roles" title="Who may do what">
        {roles ? <MarkdownTable table={roles} caption="Rights of each role" /> : null}
      </Section>
    </div>
  );
}
