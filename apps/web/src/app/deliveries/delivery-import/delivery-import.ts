import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import {
  DELIVERY_CSV_COLUMNS,
  type DeliveryCsvColumn,
  type DeliveryImportPreview,
  type DeliveryImportRow,
} from '@batchproof/shared';
import { ApiError, messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { DeliveriesApi } from '../deliveries-api';

/** What the delivery form calls each CSV column. */
const COLUMN_LABELS: Readonly<Record<DeliveryCsvColumn, string>> = {
  delivered_on: 'Delivered on',
  customer: 'Customer',
  reference: 'Reference',
  lot_code: 'Lot code',
  units: 'Units',
};
const columnLabel = (key: string) =>
  (COLUMN_LABELS as Readonly<Record<string, string>>)[key] ?? key;

/** One line of the file and what is wrong with it, in the screen's words. */
interface LineProblems {
  line: number;
  problems: { where: string; message: string }[];
}

/**
 * Imports deliveries from a CSV file in two steps: choose a file and see every row checked
 * against the workshop's customers and finished lots, then import, which is offered only when
 * every row is fine. The API saves every delivery of the file or none.
 */
@Component({
  selector: 'bp-delivery-import',
  imports: [MatAnchor, MatButton, MatIcon, MatProgressBar, MatTableModule, RouterLink],
  templateUrl: './delivery-import.html',
  styleUrl: './delivery-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class DeliveryImport {
  private readonly api = inject(DeliveriesApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly submission = new SubmissionKey();

  protected readonly columnsHint = DELIVERY_CSV_COLUMNS.join(', ');
  protected readonly columns = [
    'line',
    'deliveredOn',
    'customer',
    'reference',
    'lotCode',
    'units',
    'check',
  ];
  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<DeliveryImportPreview | null>(null);
  protected readonly busy = signal<'checking' | 'importing' | null>(null);
  protected readonly notice = signal('');
  /** The problems a refused import named (by row or for the file), listed under the notice. */
  protected readonly refusal = signal<LineProblems[]>([]);
  /** The rows needing attention with their messages, in line order. */
  protected readonly lineProblems = computed<LineProblems[]>(() =>
    (this.preview()?.rows ?? [])
      .filter((r) => !r.valid)
      .sort((a, b) => a.line - b.line)
      .map((r) => ({ line: r.line, problems: this.problemsOf(r) })),
  );
  /** Whether the file may be imported: the API says every row is fine. */
  protected readonly importable = computed(() => !!this.preview()?.commitable && !this.busy());

  protected choose(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0] ?? null;
    input.value = '';
    this.file.set(file);
    this.preview.set(null);
    this.notice.set('');
    this.refusal.set([]);
    if (file) this.check(file);
  }

  private problemsOf(row: DeliveryImportRow) {
    return Object.entries(row.errors).flatMap(([key, messages]) =>
      messages.map((message) => ({ where: columnLabel(key), message })),
    );
  }

  private check(file: File): void {
    this.busy.set('checking');
    this.api.previewImport(file).subscribe({
      next: (preview) => {
        this.busy.set(null);
        this.preview.set(preview);
      },
      error: (err: unknown) => this.refused(err),
    });
  }

  protected runImport(): void {
    const file = this.file();
    if (!file || !this.importable()) return;
    this.busy.set('importing');
    this.notice.set('');
    this.refusal.set([]);
    this.api.import(file, this.submission.for(file)).subscribe({
      next: (result) => {
        this.busy.set(null);
        this.submission.done();
        this.snackBar.open(
          `Imported ${result.imported} ${result.imported === 1 ? 'delivery' : 'deliveries'}.`,
          'OK',
          { duration: 5000 },
        );
        void this.router.navigate(['/deliveries']);
      },
      error: (err: unknown) => this.refused(err),
    });
  }

  /** A refusal: its message, and its problems by line (`rows.<line>.<column>`) or for the file. */
  private refused(err: unknown): void {
    this.busy.set(null);
    this.notice.set(messageOf(err));
    if (!(err instanceof ApiError)) return;
    const byLine = new Map<number, LineProblems>();
    for (const [key, messages] of Object.entries(err.fieldErrors)) {
      const [, line, column] = /^rows\.(\d+)\.(.+)$/.exec(key) ?? [];
      const entry = line ? Number(line) : 0;
      const problems = byLine.get(entry)?.problems ?? [];
      for (const message of messages)
        problems.push({ where: column ? columnLabel(column) : 'File', message });
      byLine.set(entry, { line: entry, problems });
    }
    this.refusal.set([...byLine.values()].sort((a, b) => a.line - b.line));
  }
}
