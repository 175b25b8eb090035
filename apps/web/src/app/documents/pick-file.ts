/* Test-only helper for component specs; app code never imports this file. */

/** Puts `file` on a native file input and fires `change`, as picking it in the browser does. */
export function pickFile(input: HTMLInputElement, file: File): void {
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  input.dispatchEvent(new Event('change'));
}
