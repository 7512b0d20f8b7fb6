'use client';
/**
 * One editable block of the handout (title, opening words, next steps) with its reading grade,
 * worked out live in lib/handout/sheet.ts (`readability.blocks`) and announced politely. Above
 * grade 8 it warns.
 */
import { useId } from 'react';
import { BLOCK_LABELS, MAX_BLOCK_CHARS, MAX_TITLE_CHARS, type BlockGrade, type HandoutBlockKey } from '@/lib/handout';

export interface BlockEditorProps {
  readonly blockKey: HandoutBlockKey;
  readonly value: string;
  /** The block's grade line and warning, from the sheet's view model. */
  readonly grade: BlockGrade | undefined;
  readonly onChange: (value: string) => void;
}

export function BlockEditor({ blockKey, value, grade, onChange }: BlockEditorProps) {
  const id = useId();
  const inputId = `${id}-input`;
  const gradeId = `${id}-grade`;
  const warnId = `${id}-warn`;
  const label = BLOCK_LABELS[blockKey];
  const above = grade?.warning !== undefined;
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
        {grade?.line ?? ''}
      </p>
      {above ? (
        <p id={warnId} className="block-editor__warn" role="status">
          {grade?.warning}
        </p>
      ) : null}
    </div>
  );
}
