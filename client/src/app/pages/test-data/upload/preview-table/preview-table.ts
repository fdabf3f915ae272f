import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { ColumnMapping } from '../column-mapping';
import { TEMPLATE_FIELDS } from '../template-fields';

/** A problem to mark in the preview: at a spreadsheet row, in a column (null: the whole row). */
export interface MarkedProblem {
  readonly row: number;
  readonly header: string | null;
  readonly message: string;
}

/**
 * The first rows of the file as a spreadsheet shows them (row numbers with the
 * header as row 1), each column labelled with the template field it feeds,
 * and the cells with a problem marked, the problem in the cell's title.
 */
@Component({
  selector: 'app-preview-table',
  templateUrl: './preview-table.html',
  styleUrl: './preview-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PreviewTable {
  readonly headers = input.required<readonly string[]>();
  readonly rows = input.required<readonly (readonly string[])[]>();
  readonly mapping = input.required<ColumnMapping>();
  readonly problems = input<readonly MarkedProblem[]>([]);

  /** header -> label of the field it feeds */
  protected readonly fieldOf = computed(() => {
    const labels = new Map<string, string>();
    for (const field of TEMPLATE_FIELDS) {
      const header = this.mapping()[field.field];
      if (header) labels.set(header, field.label);
    }
    return labels;
  });

  /** "row|header" -> messages, and row -> messages for whole-row problems. */
  protected readonly marks = computed(() => {
    const cells = new Map<string, string[]>();
    const rows = new Map<number, string[]>();
    for (const p of this.problems()) {
      if (p.header === null) rows.set(p.row, [...(rows.get(p.row) ?? []), p.message]);
      else cells.set(`${p.row}|${p.header}`, [...(cells.get(`${p.row}|${p.header}`) ?? []), p.message]);
    }
    return { cells, rows };
  });

  protected cellMark(rowIndex: number, header: string): string | null {
    return this.marks().cells.get(`${rowIndex + 2}|${header}`)?.join('; ') ?? null;
  }

  protected rowMark(rowIndex: number): string | null {
    return this.marks().rows.get(rowIndex + 2)?.join('; ') ?? null;
  }
}
