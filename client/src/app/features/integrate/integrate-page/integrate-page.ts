import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

import { ApiTokens } from '../api-tokens/api-tokens';
import { Downloads } from '../downloads/downloads';
import { Watchlists } from '../watchlists/watchlists';

/** Integrate: what programs need from Thalpos — tokens, watchlists, downloads, the API reference. */
@Component({
  selector: 'thalpos-integrate-page',
  imports: [MatIcon, ApiTokens, Watchlists, Downloads],
  templateUrl: './integrate-page.html',
  styleUrl: './integrate-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntegratePage {}
