import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  output,
  signal,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import {
  MATERIAL_CSV_COLUMNS,
  type MaterialImportPreview,
  type MaterialImportResult,
  type MaterialImportRow,
} from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { MaterialsApi } from '../materials-api';

/** Most rows the preview table shows; problems come first. */
const SHOWN_ROWS = 100;

/**
 * Imports materials from a CSV file in two steps: pick a file and see every row checked by
 * the server, then import, which is offered only when every row is valid (the server writes
 * all rows or none).
 */
@Component({
  selector: 'bp-material-import',
  imports: [MatButton, MatIcon, MatIconButton, MatProgressBar, MatTableModule],
  templateUrl: './material-import.html',
  styleUrl: './material-import.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialImport {
  /** Emits once the API has imported the file. */
  readonly imported = output<MaterialImportResult>();
  /** Emits when the maker closes the import without importing. */
  readonly closed = output<void>();

  private readonly api = inject(MaterialsApi);

  protected readonly columnsHint = MATERIAL_CSV_COLUMNS.join(', ');
  protected readonly columns = ['line', 'tradeName', 'category', 'result'];
  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<MaterialImportPreview | null>(null);
  protected readonly busy = signal<'checking' | 'importing' | null>(null);
  protected readonly notice = signal('');
  /** Rows to show: those that need attention first. */
  protected readonly shownRows = computed(() => {
    const rows = this.preview()?.rows ?? [];
    const ordered = [...rows.filter((r) => !r.valid), ...rows.filter((r) => r.valid)];
    return ordered.slice(0, SHOWN_ROWS);
  });
  /** Whether the whole file is valid, the only case in which it may be imported. */
  protected readonly importable = computed(() => {
    const p = this.preview();
    return (
      !!p && p.fileErrors.length === 0 && p.errorCount === 0 && p.rows.length > 0 && !this.busy()
    );
  });

  protected choose(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0] ?? null;
    input.value = '';
    this.file.set(file);
    this.preview.set(null);
    this.notice.set('');
    if (file) this.check(file);
  }

  protected errorList(row: MaterialImportRow): { field: string; message: string }[] {
    return Object.entries(row.errors).flatMap(([field, messages]) =>
      messages.map((message) => ({ field, message })),
    );
  }

  protected runImport(): void {
    const file = this.file();
    if (!file || !this.importable()) return;
    this.busy.set('importing');
    this.notice.set('');
    this.api.import(file).subscribe({
      next: (result) => {
        this.busy.set(null);
        this.imported.emit(result);
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.notice.set(messageOf(err));
      },
    });
  }

  private check(file: File): void {
    this.busy.set('checking');
    this.api.previewImport(file).subscribe({
      next: (preview) => {
        this.busy.set(null);
        this.preview.set(preview);
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.notice.set(messageOf(err));
      },
    });
  }
}
