'use client';

import { useEditorState, type Editor } from '@tiptap/react';
import { useRef, type KeyboardEvent, type ReactNode } from 'react';
import { cn } from '@/components/ui/cn';

interface ToolProps {
  label: string;
  shortcut?: string;
  pressed?: boolean;
  disabled?: boolean;
  onClick: () => void;
  children: ReactNode;
  wide?: boolean;
}

function Tool({ label, shortcut, pressed, disabled, onClick, children, wide }: ToolProps) {
  return (
    <button
      type="button"
      // Keep the editor's selection: a mousedown on the toolbar would otherwise blur it first.
      onMouseDown={(e) => e.preventDefault()}
      onClick={onClick}
      disabled={disabled}
      aria-pressed={pressed}
      aria-label={wide ? undefined : label}
      title={shortcut ? `${label} (${shortcut})` : label}
      className={cn(
        'inline-flex min-h-9 items-center justify-center gap-1.5 rounded-md text-sm font-semibold transition-colors disabled:opacity-50',
        wide ? 'text-brand hover:bg-granite-50 px-3' : 'text-ink hover:bg-paper-sunken min-w-9 px-2',
        pressed && 'bg-granite-100 text-granite-900',
      )}
    >
      {children}
    </button>
  );
}

/**
 * The formatting bar. One tab stop: ←/→ move between the tools (the ARIA toolbar pattern), so a
 * keyboard user reaches the text in one Tab instead of nine. Drawn disabled while `editor` is
 * still null (it is created after hydration), so the page does not move when it arrives.
 */
export function EditorToolbar({
  editor,
  onAddMechanism,
  onInsertCitation,
}: {
  editor: Editor | null;
  onAddMechanism: () => void;
  onInsertCitation: () => void;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) =>
      e && {
        bold: e.isActive('bold'),
        italic: e.isActive('italic'),
        heading: e.isActive('heading', { level: 2 }),
        subheading: e.isActive('heading', { level: 3 }),
        bullet: e.isActive('bulletList'),
        ordered: e.isActive('orderedList'),
        editable: e.isEditable,
      },
  });

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (!['ArrowLeft', 'ArrowRight', 'Home', 'End'].includes(event.key)) return;
    const buttons = Array.from(ref.current?.querySelectorAll<HTMLButtonElement>('button:not(:disabled)') ?? []);
    const index = buttons.indexOf(document.activeElement as HTMLButtonElement);
    if (index < 0) return;
    event.preventDefault();
    const next =
      event.key === 'Home'
        ? 0
        : event.key === 'End'
          ? buttons.length - 1
          : (index + (event.key === 'ArrowRight' ? 1 : -1) + buttons.length) % buttons.length;
    buttons.forEach((b, i) => (b.tabIndex = i === next ? 0 : -1));
    buttons[next].focus();
  };

  // Every tool is disabled while there is no editor, so `editor!` below is never reached without one.
  const chain = () => editor!.chain().focus();
  const off = !state?.editable;

  return (
    <div
      ref={ref}
      role="toolbar"
      aria-label="Formatting"
      aria-controls={editor ? 'review-body' : undefined}
      onKeyDown={onKeyDown}
      // Roving tab stop: only the first tool is in the tab order until arrows move it.
      onFocus={(e) => {
        const target: EventTarget = e.target;
        if (!(target instanceof HTMLButtonElement)) return;
        ref.current?.querySelectorAll('button').forEach((b) => (b.tabIndex = b === target ? 0 : -1));
      }}
      className="border-line bg-paper-sunken/70 flex flex-wrap items-center gap-1 border-b px-2 py-1.5"
    >
      <Tool
        label="Bold"
        shortcut="Ctrl+B"
        pressed={state?.bold}
        disabled={off}
        onClick={() => chain().toggleBold().run()}
      >
        <span aria-hidden="true" className="font-bold">
          B
        </span>
      </Tool>
      <Tool
        label="Italic"
        shortcut="Ctrl+I"
        pressed={state?.italic}
        disabled={off}
        onClick={() => chain().toggleItalic().run()}
      >
        <span aria-hidden="true" className="font-serif italic">
          I
        </span>
      </Tool>
      <Tool
        label="H2 heading"
        pressed={state?.heading}
        disabled={off}
        onClick={() => chain().toggleHeading({ level: 2 }).run()}
      >
        H2
      </Tool>
      <Tool
        label="H3 subheading"
        pressed={state?.subheading}
        disabled={off}
        onClick={() => chain().toggleHeading({ level: 3 }).run()}
      >
        H3
      </Tool>
      <span aria-hidden="true" className="bg-line-strong mx-1 h-6 w-px" />
      <Tool
        label="Bulleted list"
        pressed={state?.bullet}
        disabled={off}
        onClick={() => chain().toggleBulletList().run()}
      >
        <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true">
          <circle cx="2.5" cy="4" r="1.3" fill="currentColor" />
          <circle cx="2.5" cy="8" r="1.3" fill="currentColor" />
          <circle cx="2.5" cy="12" r="1.3" fill="currentColor" />
          <path d="M6 4h8M6 8h8M6 12h8" stroke="currentColor" strokeWidth="1.5" />
        </svg>
      </Tool>
      <Tool
        label="Numbered list"
        pressed={state?.ordered}
        disabled={off}
        onClick={() => chain().toggleOrderedList().run()}
      >
        <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true">
          <path
            d="M1.5 2.5h1.5v4M1.3 6.5h3.2M1.3 10h2.6l-2.6 3.5h2.8"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.1"
          />
          <path d="M6 4h8M6 11.5h8" stroke="currentColor" strokeWidth="1.5" />
        </svg>
      </Tool>
      <span aria-hidden="true" className="bg-line-strong mx-1 h-6 w-px" />
      <Tool label="Add mechanism" wide disabled={off} onClick={onAddMechanism}>
        <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true">
          <rect x="1.5" y="3" width="13" height="10" rx="2" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path d="M8 5.5v5M5.5 8h5" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        </svg>
        Add mechanism
      </Tool>
      <Tool label="Insert citation" wide disabled={off} onClick={onInsertCitation}>
        <svg viewBox="0 0 16 16" className="size-4" aria-hidden="true">
          <path
            d="M3 9.5c0-3 1.5-4.5 3.5-5M3 9.5h3v3H3zM9 9.5c0-3 1.5-4.5 3.5-5M9 9.5h3v3H9z"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.4"
            strokeLinejoin="round"
          />
        </svg>
        Insert citation
      </Tool>
    </div>
  );
}
