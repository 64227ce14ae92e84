import { DiffEditor, type DiffOnMount } from '@monaco-editor/react';
import { useEffect, useRef } from 'react';
import type { Comment } from '@shared/api/comments.ts';
import { editorOptions, monaco } from '@client/components/monaco/monaco-setup.ts';
import { diffThemeName } from './diff-theme.ts';

type CodeEditor = monaco.editor.ICodeEditor;

interface SourceDiffProps {
  /** The incumbent's source; empty when the routine has none yet. */
  original: string;
  modified: string;
  /** Names the models, so two revisions never share one. */
  modelKey: string;
  /** Line comments on the shown revision, drawn under their lines. */
  comments: readonly Comment[];
  /** A click in the gutter of the candidate's side. */
  onPickLine: (line: number) => void;
}

const gutterTargets = new Set<monaco.editor.MouseTargetType>([
  monaco.editor.MouseTargetType.GUTTER_GLYPH_MARGIN,
  monaco.editor.MouseTargetType.GUTTER_LINE_NUMBERS,
  monaco.editor.MouseTargetType.GUTTER_LINE_DECORATIONS,
]);

/** Builds the block shown under a commented line (plain text nodes: nothing is parsed as HTML). */
function commentZoneNode(lineComments: readonly Comment[]): HTMLElement {
  const node = document.createElement('div');
  node.className = 'line-comment-zone';
  for (const c of lineComments) {
    const row = document.createElement('div');
    const who = document.createElement('strong');
    who.textContent = `${c.author.login}: `;
    row.append(who, document.createTextNode(c.body.replace(/\s+/g, ' ')));
    node.append(row);
  }
  return node;
}

/**
 * The candidate's revision against the incumbent in Monaco's diff editor (read only). A click in
 * the right-hand gutter picks that line for a comment; line comments show under their lines.
 */
export function SourceDiff({
  original,
  modified,
  modelKey,
  comments,
  onPickLine,
}: SourceDiffProps) {
  const editorRef = useRef<CodeEditor | null>(null);
  const pickRef = useRef(onPickLine);
  useEffect(() => {
    pickRef.current = onPickLine;
  }, [onPickLine]);

  const onMount: DiffOnMount = (diff) => {
    // The read-only sides' input elements come without a name, and Monaco may replace them
    // later; name every one of them whenever the editor's DOM changes.
    const sides: [CodeEditor, string][] = [
      [diff.getOriginalEditor(), 'The incumbent’s source (read only)'],
      [diff.getModifiedEditor(), 'This revision’s source (read only)'],
    ];
    const nameInputs = () => {
      for (const [side, label] of sides) {
        const inputs = side.getDomNode()?.querySelectorAll('.native-edit-context, textarea') ?? [];
        for (const input of inputs) {
          if (input.getAttribute('aria-label') !== label) input.setAttribute('aria-label', label);
        }
      }
    };
    for (const [side, label] of sides) side.updateOptions({ ariaLabel: label });
    nameInputs();
    const observer = new MutationObserver(nameInputs);
    observer.observe(diff.getContainerDomNode(), {
      childList: true,
      subtree: true,
      attributeFilter: ['aria-label'],
    });
    diff.onDidDispose(() => observer.disconnect());
    const editor = diff.getModifiedEditor();
    editorRef.current = editor;
    editor.onMouseDown((e) => {
      const line = e.target.position?.lineNumber;
      if (line && gutterTargets.has(e.target.type)) pickRef.current(line);
    });
    drawComments(editor, comments);
  };

  useEffect(() => {
    if (editorRef.current) drawComments(editorRef.current, comments);
  }, [comments, modified]);

  return (
    <div className="h-[480px] overflow-hidden rounded border border-rule bg-white">
      <DiffEditor
        original={original}
        modified={modified}
        language="typescript"
        theme={diffThemeName}
        originalModelPath={`file:///review/${modelKey}/incumbent.ts`}
        modifiedModelPath={`file:///review/${modelKey}/candidate.ts`}
        loading={<p className="p-4 text-ink-soft">Loading the diff…</p>}
        onMount={onMount}
        options={{
          ...editorOptions,
          readOnly: true,
          // A plain textarea input, which takes the aria labels below (the EditContext one does not).
          editContext: false,
          originalEditable: false,
          renderSideBySide: true,
          glyphMargin: true,
          originalAriaLabel: 'The incumbent’s source (read only)',
          modifiedAriaLabel: 'This revision’s source (read only)',
        }}
      />
    </div>
  );
}

const zoneIds = new WeakMap<CodeEditor, string[]>();
const decorationSets = new WeakMap<CodeEditor, monaco.editor.IEditorDecorationsCollection>();

function drawComments(editor: CodeEditor, comments: readonly Comment[]) {
  const byLine = new Map<number, Comment[]>();
  for (const c of comments) {
    if (c.line === null) continue;
    byLine.set(c.line, [...(byLine.get(c.line) ?? []), c]);
  }
  editor.changeViewZones((accessor) => {
    for (const id of zoneIds.get(editor) ?? []) accessor.removeZone(id);
    const ids: string[] = [];
    for (const [line, list] of byLine) {
      ids.push(
        accessor.addZone({
          afterLineNumber: line,
          heightInLines: list.length + 0.6,
          domNode: commentZoneNode(list),
        }),
      );
    }
    zoneIds.set(editor, ids);
  });
  const decorations = [...byLine.keys()].map((line) => ({
    range: new monaco.Range(line, 1, line, 1),
    options: {
      glyphMarginClassName: 'line-comment-glyph',
      glyphMarginHoverMessage: { value: 'Commented line' },
    },
  }));
  const existing = decorationSets.get(editor);
  if (existing) existing.set(decorations);
  else decorationSets.set(editor, editor.createDecorationsCollection(decorations));
}
