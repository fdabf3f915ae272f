import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, effect, inject, input, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';

import { UploadProblem } from '../../../../shared/catalogue/coupon-wire';

/**
 * The server's refusal of a file, one line per problem with its row (as a
 * spreadsheet numbers it), column, field, reason and fix: sortable and paged,
 * and downloadable as CSV to work through beside the file.
 */
@Component({
  selector: 'app-upload-problems',
  imports: [MatButtonModule, MatIconModule, MatPaginatorModule, MatSortModule, MatTableModule],
  templateUrl: './upload-problems.html',
  styleUrl: './upload-problems.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadProblems {
  readonly problems = input.required<readonly UploadProblem[]>();
  /** How many problems the server found (it lists the first 1000). */
  readonly problemCount = input<number | null>(null);

  private readonly document = inject(DOCUMENT);
  protected readonly columns = ['row', 'column', 'field', 'message', 'fix'];
  protected readonly dataSource = new MatTableDataSource<UploadProblem>([]);
  private readonly paginator = viewChild(MatPaginator);
  private readonly sort = viewChild(MatSort);

  constructor() {
    effect(() => {
      this.dataSource.data = [...this.problems()];
      this.dataSource.paginator = this.paginator() ?? null;
      this.dataSource.sort = this.sort() ?? null;
    });
  }

  /** Saves the listed problems as a CSV file (built in the page; nothing is sent). */
  protected download(): void {
    const quote = (v: unknown) => `"${String(v ?? '').replace(/"/g, '""')}"`;
    const lines = [
      ['row', 'column', 'field', 'problem', 'fix'].join(','),
      ...this.problems().map((p) => [p.row ?? '', p.column ?? '', p.field, p.message, p.fix ?? ''].map(quote).join(',')),
    ];
    const url = URL.createObjectURL(new Blob([lines.join('\r\n') + '\r\n'], { type: 'text/csv' }));
    const link = this.document.createElement('a');
    link.href = url;
    link.download = 'upload-problems.csv';
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 0);
  }
}
