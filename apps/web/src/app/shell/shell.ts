import { BreakpointObserver } from '@angular/cdk/layout';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  linkedSignal,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatListItem, MatListItemIcon, MatListItemTitle, MatNavList } from '@angular/material/list';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbar } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { type Role, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../auth/session';
import { ApiError, messageOf } from '../http/api-error';

/** One entry of the side navigation; entries without a link are not built yet. */
interface NavEntry {
  label: string;
  icon: string;
  link?: string;
  /** Who sees the entry; everyone when omitted. */
  roles?: readonly Role[];
}

/** The side navigation follows the maker's work (design direction). */
const NAV: readonly NavEntry[] = [
  { label: 'Home', icon: 'home', link: '/' },
  { label: 'Formulas', icon: 'science', link: '/formulas', roles: ROLE_SETS.members },
  { label: 'Materials', icon: 'inventory_2', link: '/materials', roles: ROLE_SETS.members },
  { label: 'Lots', icon: 'move_to_inbox', link: '/lots', roles: ROLE_SETS.members },
  { label: 'Production', icon: 'scale', link: '/production', roles: ROLE_SETS.members },
  { label: 'Labels', icon: 'label', link: '/labels', roles: ROLE_SETS.members },
  { label: 'Deliveries', icon: 'local_shipping', link: '/deliveries', roles: ROLE_SETS.members },
  { label: 'Trace', icon: 'route', link: '/trace', roles: ROLE_SETS.members },
  { label: 'Recalls', icon: 'campaign', link: '/recalls', roles: ROLE_SETS.members },
  { label: 'Complaints', icon: 'report', link: '/complaints', roles: ROLE_SETS.members },
  { label: 'Assessments', icon: 'fact_check', link: '/assessments', roles: ROLE_SETS.assessments },
  { label: 'Readiness', icon: 'storefront', link: '/readiness', roles: ROLE_SETS.members },
  { label: 'Reference lists', icon: 'menu_book', link: '/reference' },
  { label: 'Workshop', icon: 'groups', link: '/workshop', roles: ROLE_SETS.members },
];

/** Below this width the side navigation becomes an overlay opened from the toolbar. */
const NARROW = '(max-width: 839.98px)';

/** The signed-in frame: toolbar, side navigation and the page. */
@Component({
  selector: 'bp-shell',
  imports: [
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    MatButton,
    MatIcon,
    MatIconButton,
    MatListItem,
    MatListItemIcon,
    MatListItemTitle,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    MatNavList,
    MatSidenav,
    MatSidenavContainer,
    MatSidenavContent,
    MatToolbar,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly breakpoints = inject(BreakpointObserver);

  protected readonly user = this.session.user;
  /** Whether a workshop switch is under way (the switcher waits for it). */
  protected readonly switching = signal(false);
  /**
   * The workshop whose pages the outlet shows: a switch rebuilds the page, so nothing read for the
   * workshop left stays on screen. Signing out keeps it (the shell is on its way to sign-in).
   */
  private readonly pageWorkshop = linkedSignal<string | null, string | null>({
    source: this.session.workshopId,
    computation: (id, previous) => id ?? previous?.value ?? null,
  });
  /** The one page the outlet shows, keyed by its workshop (the template rebuilds it on a change). */
  protected readonly pages = computed(() => [{ workshopId: this.pageWorkshop() }]);
  /** Whether the window is narrow enough for the overlay navigation. */
  protected readonly narrow = toSignal(
    this.breakpoints.observe(NARROW).pipe(map((state) => state.matches)),
    {
      initialValue: this.breakpoints.isMatched(NARROW),
    },
  );
  private readonly visible = computed(() =>
    NAV.filter((entry) => !entry.roles || this.session.hasRole(entry.roles)),
  );
  /** Entries with a page to go to. */
  protected readonly built = computed(() =>
    this.visible().filter((entry) => entry.link !== undefined),
  );
  /** Entries shown so makers see where the product is going, but not yet links. */
  protected readonly comingSoon = computed(() =>
    this.visible().filter((entry) => entry.link === undefined),
  );

  constructor() {
    // A session can end under the page (a refused refresh): go to sign-in rather than fail.
    effect(() => {
      if (!this.session.signedIn()) void this.router.navigate(['/sign-in']);
    });
  }

  /**
   * Moves focus past the toolbar and the navigation to the page's content, so keyboard and
   * screen-reader users start where the work is (the router would treat the bare fragment as a
   * navigation, so the link's default is prevented).
   */
  protected skipToContent(event: Event, main: HTMLElement): void {
    event.preventDefault();
    main.focus();
  }

  protected closeIfOverlay(sidenav: MatSidenav): void {
    if (this.narrow()) void sidenav.close();
  }

  /** Moves to another of the person's workshops (the session goes Home and says so). */
  protected switchTo(workshopId: string): void {
    if (workshopId === this.session.workshopId() || this.switching()) return;
    this.switching.set(true);
    this.session.switchWorkshop(workshopId).subscribe({
      next: (user) => {
        this.switching.set(false);
        if (user)
          this.snackBar.open(`Now working in ${user.workshop.name}.`, 'OK', { duration: 5000 });
      },
      error: (err: unknown) => {
        this.switching.set(false);
        // A workshop the person no longer belongs to is refused with a field error naming it.
        const refusal = err instanceof ApiError ? err.fieldErrors['workshopId']?.[0] : undefined;
        this.snackBar.open(refusal ?? messageOf(err), 'OK', { duration: 6000 });
      },
    });
  }

  protected signOut(): void {
    this.session.signOut().subscribe(() => this.signedOut('You are signed out.'));
  }

  /** Ends the sessions on every device, for a lost laptop or a shared password. */
  protected signOutEverywhere(): void {
    this.session
      .signOutEverywhere()
      .subscribe(() => this.signedOut('You are signed out on every device.'));
  }

  private signedOut(message: string): void {
    this.snackBar.open(message, undefined, { duration: 4000 });
    void this.router.navigate(['/sign-in']);
  }
}
