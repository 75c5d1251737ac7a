import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { ServerHealth } from '../server-info/server-health';
import { Session } from '../session/session';
import { NAV_GROUPS } from './nav-items';

/** The signed-in frame: toolbar with the person's menu, side navigation by role, and the screen. */
@Component({
  selector: 'pwc-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatSidenavModule, MatListModule, MatIconModule, MatButtonModule, MatMenuModule, MatDividerModule, MatTooltipModule],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly router = inject(Router);
  private readonly health = inject(ServerHealth);
  protected readonly session = inject(Session);
  /** Whether the window is narrow: the navigation then slides over the screen. */
  protected readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 900px)').pipe(map((state) => state.matches)), { initialValue: false });
  protected readonly groups = computed(() =>
    NAV_GROUPS.map((group) => ({
      title: group.title,
      items: group.items.filter((item) => (!item.permission || this.session.can(item.permission)) && (!item.needsMailbox || this.health.hasMailbox())),
    })).filter((group) => group.items.length > 0),
  );
  protected readonly version = computed(() => this.health.health()?.version ?? null);

  /** Signs out and goes to the sign-in page. */
  async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigate(['/sign-in']);
  }
}
