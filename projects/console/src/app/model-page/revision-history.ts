import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { RevisionSummary } from '../api/api-types';
import type { RevisionPair } from './revision-pair';

/** A row of the history: the revision and whether its loop (plant + compensator) differs from the one before. */
interface HistoryRow {
  readonly revision: RevisionSummary;
  readonly shortHash: string;
  /** Same content hash as the revision before it: only name, tags, description or design changed. */
  readonly sameLoop: boolean;
  readonly previous: number | null;
}

/**
 * The revisions of a model, newest first: number, author, time, comment and content hash, with "View"
 * (read-only) and "Changes" (compared with the revision before) on each row.
 */
@Component({
  selector: 'pwc-revision-history',
  imports: [DatePipe, MatTableModule, MatButtonModule, MatIconModule, MatTooltipModule],
  template: `
    <div class="pwc-table-wrap">
      <table mat-table [dataSource]="rows()" aria-label="Revision history">
        <ng-container matColumnDef="revision">
          <th mat-header-cell *matHeaderCellDef>Revision</th>
          <td mat-cell *matCellDef="let row">
            <strong>{{ row.revision.revision }}</strong>
            @if (row.revision.revision === current()) {
              <span class="pwc-status good">current</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="author">
          <th mat-header-cell *matHeaderCellDef>Author</th>
          <td mat-cell *matCellDef="let row" class="author">{{ row.revision.author?.name ?? 'unknown' }}</td>
        </ng-container>
        <ng-container matColumnDef="time">
          <th mat-header-cell *matHeaderCellDef>Saved</th>
          <td mat-cell *matCellDef="let row" class="time">{{ row.revision.createdAt | date: 'd MMM y, HH:mm:ss' }}</td>
        </ng-container>
        <ng-container matColumnDef="comment">
          <th mat-header-cell *matHeaderCellDef>Comment</th>
          <td mat-cell *matCellDef="let row" class="comment">{{ row.revision.comment || '(no comment)' }}</td>
        </ng-container>
        <ng-container matColumnDef="hash">
          <th mat-header-cell *matHeaderCellDef><span matTooltip="SHA-256 of the plant and compensator: equal hashes mean the same loop">Loop hash</span></th>
          <td mat-cell *matCellDef="let row">
            <code [matTooltip]="row.revision.contentHash">{{ row.shortHash }}</code>
            @if (row.sameLoop) {
              <span class="same">loop unchanged</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let row" class="actions">
            @if (row.revision.revision === shown()) {
              <span class="pwc-status">shown above</span>
            } @else {
              <button mat-button type="button" (click)="viewRevision.emit(row.revision.revision === current() ? null : row.revision.revision)" [attr.aria-label]="'View revision ' + row.revision.revision">
                <mat-icon>visibility</mat-icon>View
              </button>
            }
            @if (row.previous !== null) {
              <button mat-button type="button" (click)="compareRevisions.emit({ from: row.previous, to: row.revision.revision })" [attr.aria-label]="'Changes in revision ' + row.revision.revision">
                <mat-icon>compare_arrows</mat-icon>Changes
              </button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns" [class.shown]="row.revision.revision === shown()" [attr.data-revision]="row.revision.revision"></tr>
      </table>
    </div>
  `,
  styles: `
    .time,
    .author {
      white-space: nowrap;
    }
    .comment {
      min-width: 240px;
      max-width: 520px;
    }
    .same {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .pwc-status {
      margin-left: 8px;
    }
    td.actions {
      white-space: nowrap;
      text-align: right;
    }
    tr.shown td {
      background: var(--mat-sys-secondary-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionHistory {
  /** The revisions, newest first (as `GET /models/{id}/revisions` lists them). */
  readonly revisions = input.required<readonly RevisionSummary[]>();
  /** The model's current revision. */
  readonly current = input.required<number>();
  /** The revision the page shows above (the current one unless an older one is open). */
  readonly shown = input.required<number>();
  /** Asks the page to show a revision read-only (null: the current one). */
  readonly viewRevision = output<number | null>();
  /** Asks the page to compare two revisions. */
  readonly compareRevisions = output<RevisionPair>();

  protected readonly columns = ['revision', 'author', 'time', 'comment', 'hash', 'actions'];
  protected readonly rows = computed<HistoryRow[]>(() => {
    const sorted = [...this.revisions()].sort((a, b) => b.revision - a.revision);
    return sorted.map((revision, i) => {
      const before = sorted[i + 1];
      return { revision, shortHash: revision.contentHash.slice(0, 10), sameLoop: before !== undefined && before.contentHash === revision.contentHash, previous: before?.revision ?? null };
    });
  });
}
