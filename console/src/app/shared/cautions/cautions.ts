import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The product's cautions in short (DESIGN.md, "Cautions the product shows"). */
export const CAUTIONS: readonly string[] = [
  'Results are estimates from a sample and a model.',
  'CAPM rests on strong assumptions, the market index is only a proxy for the market portfolio, and historical betas may not hold going forward.',
  'Clinometer supports the firm’s valuation policy; it does not replace it or licensed professional judgement, and it is not investment advice.',
];

@Component({
  selector: 'clino-cautions',
  imports: [MatIconModule],
  template: `
    <mat-icon class="cautions-icon" aria-hidden="true">info</mat-icon>
    <p>
      @for (caution of cautions; track $index) {
        <span>{{ caution }}</span>
      }
    </p>
  `,
  styleUrl: './cautions.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { role: 'note', 'aria-label': 'Cautions', 'data-testid': 'cautions' },
})
export class Cautions {
  protected readonly cautions = CAUTIONS;
}
