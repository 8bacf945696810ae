import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

interface Duty {
  icon: string;
  role: string;
  does: string;
}

/** What Thalpos is for and who does what in it. */
@Component({
  selector: 'thalpos-home-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  protected readonly duties: readonly Duty[] = [
    {
      icon: 'menu_book',
      role: 'Reader',
      does: 'Browses and searches the published values, and calculates reaction enthalpies. No account needed.',
    },
    {
      icon: 'terminal',
      role: 'Engineer',
      does: 'A reader with an API token: queries the reaction-enthalpy API from scripts, spreadsheets and process models, at a higher rate limit.',
    },
    {
      icon: 'edit_note',
      role: 'Curator',
      does: 'Proposes new species, values and phase records, each with its source; can withdraw their own proposals and upload in bulk.',
    },
    {
      icon: 'fact_check',
      role: 'Editor',
      does: 'Reviews proposals (approve, reject or ask for changes, never their own), then assembles and publishes releases.',
    },
    {
      icon: 'admin_panel_settings',
      role: 'Admin',
      does: 'Manages users and their roles. Every change of role is recorded in the audit log.',
    },
    {
      icon: 'sync_alt',
      role: 'Integrator',
      does: 'Pulls versioned exports into process simulators and property packages, checks them against their checksums and reads the diff between releases.',
    },
  ];
}
