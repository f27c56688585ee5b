import type { ReactNode } from 'react';

type Tone = 'fault' | 'caution' | 'sound' | 'info';

const TONES: Record<Tone, { box: string; glyph: string; word: string }> = {
  fault: { box: 'border-fault/40 bg-fault-wash text-fault', glyph: '✕', word: 'Problem' },
  caution: { box: 'border-caution/40 bg-caution-wash text-caution', glyph: '!', word: 'Caution' },
  sound: { box: 'border-sound/40 bg-sound-wash text-sound', glyph: '✓', word: 'Done' },
  info: { box: 'border-rule-strong bg-paper-raised text-ink-soft', glyph: 'i', word: 'Note' },
};

/** A boxed message whose tone is also spelled out in words and a glyph, not colour alone. */
export function Notice({
  tone = 'info',
  title,
  children,
}: {
  tone?: Tone;
  title?: string;
  children?: ReactNode;
}) {
  const t = TONES[tone];
  return (
    <div
      role={tone === 'fault' ? 'alert' : 'status'}
      className={`flex gap-3 rounded-md border px-4 py-3 ${t.box}`}
    >
      <span
        aria-hidden
        className="mt-0.5 grid size-5 shrink-0 place-items-center rounded-full border border-current text-xs font-bold"
      >
        {t.glyph}
      </span>
      <div className="text-sm text-ink">
        <p className="font-semibold">
          <span className="sr-only">{t.word}: </span>
          {title}
        </p>
        {children ? <div className="mt-1 text-ink-soft">{children}</div> : null}
      </div>
    </div>
  );
}
