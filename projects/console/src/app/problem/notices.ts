import { inject, Injectable } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { type ApiProblem, problemSummary } from './api-problem';

/** The console's snackbar: short confirmations and the problems the API answered. */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly snackBar = inject(MatSnackBar);

  /** A short confirmation ("Key revoked"). */
  done(message: string): void {
    this.snackBar.open(message, 'OK', { duration: 4000 });
  }

  /** A problem, with its title and detail; stays until dismissed when it is a server error. */
  problem(problem: ApiProblem): void {
    this.snackBar.open(problemSummary(problem), 'Dismiss', { duration: problem.status >= 500 || problem.status === 0 ? undefined : 8000, panelClass: 'pwc-problem-snack' });
  }
}
