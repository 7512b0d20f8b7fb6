'use client';
/**
 * One editable block of the handout (title, opening words, next steps) with its reading grade,
 * worked out live by lib/readability and announced politely. Above grade 8 it warns.
 */
import { useId } from 'react';
import { BLOCK_LABELS, MAX_BLOCK_CHARS, MAX_TITLE_CHARS, type BlockReadability, type HandoutBlockKey } from '@/lib/handout';
import { MAX_GRADE } from '@/lib/readability';

export interface BlockEditorProps {
  readonly blockKey: HandoutBlockKey;
  readonly value: string;
  readonly score: BlockReadability | undefined;
  readonly onChange: (value: string) => void;
}

function gradeText(score: BlockReadability | undefined): string {
  if (!score) return '';
  if (!score.score.ok) return 'No words yet, so no reading grade.';
  const { grade, readingEase } = score.score.value;
  return `Reading grade ${grade.toFixed(1)} (aim for ${MAX_GRADE} or below); reading ease ${readingEase.toFixed(0)}.`;
}

export function BlockEditor({ blockKey, value, score, onChange }: BlockEditorProps) {
  const id = useId();
  const inputId = `${id}-input`;
  const gradeId = `${id}-grade`;
  const warnId = `${id}-warn`;
  const label = BLOCK_LABELS[blockKey];
  const above = score?.aboveTarget === true;
  const describedBy = above ? `${gradeId} ${warnId}` : gradeId;
  return (
    <div className="block-editor">
      <label htmlFor={inputId} className="block-editor__label">
        {label}
      </label>
      {blockKey === 'title' ? (
        <input
          id={inputId}
          type="text"
          value={value}
          maxLength={MAX_TITLE_CHARS}
          aria-describedby={describedBy}
          onChange={(e) => onChange(e.target.value)}
        />
      ) : (
        <textarea
          id={inputId}
          value={value}
          rows={3}
          maxLength={MAX_BLOCK_CHARS}
          aria-describedby={describedBy}
          onChange={(e) => onChange(e.target.value)}
        />
      )}
      <p id={gradeId} className="block-editor__grade" aria-live="polite">
        {gradeText(score)}
      </p>
      {above ? (
        <p id={warnId} className="block-editor__warn" role="status">
          Above grade {MAX_GRADE}: try shorter sentences and everyday words.
        </p>
      ) : null}
    </div>
  );
}
