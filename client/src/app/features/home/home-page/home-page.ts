import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

interface Screen {
  icon: string;
  title: string;
  path: string;
  does: string;
}

interface Duty {
  icon: string;
  name: string;
  does: string;
}

/** What Thalpos is for, the screens that can be opened today, and the roles. */
@Component({
  selector: 'thalpos-home-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  /** Only screens that exist: each links to its route. */
  protected readonly screens: readonly Screen[] = [
    {
      icon: 'table_view',
      title: 'Browse',
      path: '/browse',
      does: 'Search the species of a published release and read their formation enthalpies with phase, uncertainty and source.',
    },
    {
      icon: 'science',
      title: 'Reaction enthalpy',
      path: '/calculate/reaction',
      does: 'ΔrH° of a balanced equation from a chosen release, term by term, with the source of every value.',
    },
    {
      icon: 'account_tree',
      title: 'Hess combination',
      path: '/calculate/hess',
      does: 'Combine reaction steps you measured or looked up into a target reaction and sum their ΔH, with the uncertainty.',
    },
    {
      icon: 'inventory_2',
      title: 'Releases',
      path: '/releases',
      does: 'Every published release as CSV, JSON and XML with its SHA-256, and what changed between any two.',
    },
  ];

  /** The four roles the registry knows, in order of what they may do. */
  protected readonly roles: readonly Duty[] = [
    {
      icon: 'menu_book',
      name: 'Reader',
      does: 'Reads published values and calculates. Anyone is a reader, with or without an account.',
    },
    {
      icon: 'edit_note',
      name: 'Curator',
      does: 'Proposes new species, values and phase records, each with its source.',
    },
    {
      icon: 'fact_check',
      name: 'Editor',
      does: 'Reviews proposals (never their own) and publishes releases.',
    },
    {
      icon: 'admin_panel_settings',
      name: 'Admin',
      does: 'Manages users and their roles; every change of role is recorded in the audit log.',
    },
  ];

  /** Not roles: ways readers use the registry from their own programs. */
  protected readonly uses: readonly Duty[] = [
    {
      icon: 'terminal',
      name: 'Engineers',
      does: 'Readers with an API token, who query reaction enthalpies from scripts, spreadsheets and process models at a higher rate limit.',
    },
    {
      icon: 'sync_alt',
      name: 'Integrators',
      does: 'Readers with an API token, who pull whole releases into simulators and property packages.',
    },
  ];
}
