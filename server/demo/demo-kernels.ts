import type { RoutineSlug } from '@shared/routines.ts';
import { exampleKernels, type ExampleName } from '@sandbox/kernels/example-catalog.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { starterKernelFiles } from '@sandbox/kernels/starter-kernels.ts';
import { inlineKernels, type InlineKernelName } from './demo-kernel-sources.ts';

/** Where a demo revision's source comes from. */
export type KernelRef =
  { starter: RoutineSlug } | { example: ExampleName } | { inline: InlineKernelName };

/** The source text of a demo revision. */
export function demoKernelSource(ref: KernelRef): string {
  if ('starter' in ref) return readKernelSource(starterKernelFiles[ref.starter]);
  if ('example' in ref) return readKernelSource(exampleKernels[ref.example].file);
  return inlineKernels[ref.inline];
}
