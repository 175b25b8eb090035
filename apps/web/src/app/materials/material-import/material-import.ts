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
import { MatCheckbox } from '@angular/material/checkbox';
import { MatTableModule } from '@angular/material/table';
import {
  MATERIAL_CSV_COLUMNS,
  type MaterialImportPreview,
  type MaterialImportResult,
  type MaterialImportRow,
} from '@batchproof/shared';
import { ApiError, messageOf } from '../../http/api-error';
import { CATEGORY_LABELS } from '../material-labels';
import { MaterialsApi } from '../materials-api';
import { columnLabel } from './csv-columns';

/** Most rows the preview table shows; problems come first. */
const SHOWN_ROWS = 100;

/** One row that needs attention, with its messages in the screen's words. */
interface RowProblems {
  line: number;
  tradeName: string;
  problems: { where: string; message: string }[];
}

/**
 * Imports materials from a CSV file in two steps: pick a file and see every row checked by
 * the server, then import, which is offered only when every row is valid (the server writes
 * all rows or none). The reasons are listed by row above the table, where no cell width can
 * cut them short; the table only says which rows are ready.
 */
@Component({
  selector: 'bp-material-import',
  imports: [MatButton, MatCheckbox, MatIcon, MatIconButton, MatProgressBar, MatTableModule],
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
  /** Whether rows matching a material already on file update it rather than add a copy. */
  protected readonly updateExisting = signal(false);
  /** What the server added to a refusal of the whole file, such as how to save it as UTF-8. */
  protected readonly noticeDetails = signal<readonly string[]>([]);
  /** Rows to show: those that need attention first. */
  protected readonly shownRows = computed(() => {
    const rows = this.preview()?.rows ?? [];
    const ordered = [...rows.filter((r) => !r.valid), ...rows.filter((r) => r.valid)];
    return ordered.slice(0, SHOWN_ROWS);
  });
  /** The rows that need attention with their messages, in line order. */
  protected readonly rowProblems = computed<RowProblems[]>(() =>
    this.shownRows()
      .filter((r) => !r.valid)
      .sort((a, b) => a.line - b.line)
      .map((r) => ({ line: r.line, tradeName: r.tradeName, problems: this.problemsOf(r) })),
  );
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
    this.noticeDetails.set([]);
    if (file) this.check(file);
  }

  /** How many messages a row carries. */
  protected problemCount(row: MaterialImportRow): number {
    return Object.values(row.errors).reduce((n, messages) => n + messages.length, 0);
  }

  /** A category cell as the screen names it; a value that is no category stays as written. */
  protected categoryLabel(cell: string): string {
    return (CATEGORY_LABELS as Readonly<Record<string, string>>)[cell] ?? cell;
  }

  private problemsOf(row: MaterialImportRow) {
    return Object.entries(row.errors).flatMap(([key, messages]) =>
      messages.map((message) => ({ where: columnLabel(key), message })),
    );
  }

  private refused(err: unknown): void {
    this.busy.set(null);
    this.notice.set(messageOf(err));
    this.noticeDetails.set(err instanceof ApiError ? (err.fieldErrors['file'] ?? []) : []);
  }

  protected runImport(): void {
    const file = this.file();
    if (!file || !this.importable()) return;
    this.busy.set('importing');
    this.notice.set('');
    this.noticeDetails.set([]);
    this.api.import(file, this.updateExisting() ? 'update' : 'create').subscribe({
      next: (result) => {
        this.busy.set(null);
        this.imported.emit(result);
      },
      error: (err: unknown) => this.refused(err),
    });
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
}
