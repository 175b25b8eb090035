import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltip } from '@angular/material/tooltip';
import { ROLE_SETS, type SupplierDocument } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { messageOf } from '../../http/api-error';
import { DocumentStatusList } from '../document-status-list/document-status-list';
import { DocumentUpload } from '../document-upload/document-upload';
import { DOCUMENT_KIND_LABELS, fileSize } from '../document-kinds';
import { DocumentsApi } from '../documents-api';
import { ArchivedToggle } from '../../housekeeping/archived-toggle';
import { RecordActions } from '../../housekeeping/record-actions';
import { saveFile } from '../save-file';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';

/**
 * The supplier documents of one material or one lot: the list (each file downloadable), the
 * upload form for owners and formulators, and, for a material, which expected documents are
 * missing or older than a year. Give exactly one of `materialId` and `lotId`.
 */
@Component({
  selector: 'bp-document-panel',
  imports: [
    CalendarDayPipe,
    MatButton,
    MatIcon,
    MatIconButton,
    MatProgressBar,
    MatTableModule,
    MatTooltip,
    DocumentStatusList,
    DocumentUpload,
    ArchivedToggle,
    RecordActions,
  ],
  templateUrl: './document-panel.html',
  styleUrl: './document-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DocumentPanel {
  /** The material whose documents to show (give this or `lotId`). */
  readonly materialId = input<string>();
  /** The lot whose documents to show (give this or `materialId`). */
  readonly lotId = input<string>();
  /** Emits each newly uploaded document, after the list has been asked to refresh. */
  readonly uploaded = output<SupplierDocument>();

  private readonly api = inject(DocumentsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);

  /** Whether the signed-in member may upload documents. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  /** Whether archived documents are listed too. */
  protected readonly showArchived = signal(false);
  /** The document whose replace, archive and delete buttons are shown. */
  protected readonly selected = signal<SupplierDocument | null>(null);
  /** The document the next upload replaces, if any. */
  protected readonly replacing = signal<SupplierDocument | null>(null);
  protected readonly documents = this.api.list(() => ({
    materialId: this.materialId(),
    lotId: this.lotId(),
    includeArchived: this.showArchived(),
  }));
  protected readonly status = this.api.status(this.materialId);
  protected readonly rows = computed(() =>
    this.documents.hasValue() ? this.documents.value() : [],
  );
  protected readonly loadError = computed(() => {
    const error = this.documents.error() ?? this.status.error();
    return error ? messageOf(error) : '';
  });
  protected readonly columns = ['document', 'issuedOn', 'actions'];
  protected kindLabel(doc: SupplierDocument): string {
    return DOCUMENT_KIND_LABELS[doc.kind];
  }

  protected readonly fileSize = fileSize;
  /** The id of the document being downloaded, if any. */
  protected readonly downloading = signal<string | null>(null);

  protected onDeleted(): void {
    this.selected.set(null);
    this.reload();
  }

  protected onUploaded(doc: SupplierDocument): void {
    this.replacing.set(null);
    this.selected.set(null);
    this.documents.reload();
    this.status.reload();
    this.uploaded.emit(doc);
  }

  protected reload(): void {
    this.documents.reload();
    this.status.reload();
  }

  protected download(doc: SupplierDocument): void {
    this.downloading.set(doc.id);
    this.api.content(doc.id).subscribe({
      next: (blob) => {
        this.downloading.set(null);
        saveFile(blob, doc.filename);
      },
      error: (err: unknown) => {
        this.downloading.set(null);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}
