import { monaco } from '@client/components/monaco/monaco-setup.ts';

/** Our diff colours: inserted and removed lines in faint teal and vermilion, with ink-dark tokens
 * so every token keeps a 4.5:1 contrast on the tinted lines (WCAG AA). */
export const diffThemeName = 'stablehand-diff';

monaco.editor.defineTheme(diffThemeName, {
  base: 'vs',
  inherit: true,
  rules: [
    { token: 'comment', foreground: '3f5a36' },
    { token: 'number', foreground: '0b5e40' },
    { token: 'type', foreground: '1c5566' },
    { token: 'type.identifier', foreground: '1c5566' },
    { token: 'string', foreground: '8f1d12' },
  ],
  colors: {
    'diffEditor.insertedTextBackground': '#1f7a7224',
    'diffEditor.removedTextBackground': '#c4432b24',
    'diffEditor.insertedLineBackground': '#1f7a7212',
    'diffEditor.removedLineBackground': '#c4432b12',
  },
});
