// The invented demo scenario: a fictional fund ("Tarn Hollow Partners") holding fictional securities
// priced against a fictional index ("Tarn Broad Market"). Nothing here is real market data. Each
// security's true beta is fixed here, so a run on the generated files can be read against it.

export interface DemoSecurity {
  readonly code: string;
  readonly name: string;
  readonly sector: string;
  /** The beta the factor model draws its returns with. */
  readonly trueBeta: number;
  /** Daily idiosyncratic volatility. */
  readonly residualVol: number;
  /** Share of market days on which no trade happens (the last price repeats). */
  readonly staleShare: number;
  readonly listed?: string; // first priced date (a late listing)
  readonly delisted?: string; // last priced date
  /** Debt to equity at market values, for the capital-structure outputs. */
  readonly debtToEquity: number;
}

const SECTORS = [
  { key: 'rail', name: 'Transport', base: 1.05 },
  { key: 'grid', name: 'Utilities', base: 0.55 },
  { key: 'shop', name: 'Consumer', base: 0.9 },
  { key: 'chip', name: 'Technology', base: 1.35 },
  { key: 'care', name: 'Health', base: 0.75 },
  { key: 'bank', name: 'Financials', base: 1.15 },
] as const;

const NAME_PARTS = ['Alder', 'Brackenridge', 'Corrow', 'Dunmere', 'Elsworth', 'Fallowby', 'Glenhart', 'Harrowfield'];
const SECTOR_WORDS: Readonly<Record<string, string>> = {
  rail: 'Haulage', grid: 'Power', shop: 'Stores', chip: 'Circuits', care: 'Clinics', bank: 'Mutual',
};

/** 48 securities: 8 per sector, codes `QZ` + sector initial + number, clearly not exchange tickers. */
export function demoSecurities(): DemoSecurity[] {
  const out: DemoSecurity[] = [];
  SECTORS.forEach((sector, s) => {
    for (let i = 0; i < 8; i += 1) {
      const code = `QZ-${sector.key.toUpperCase()}${String(i + 1).padStart(2, '0')}`;
      out.push({
        code,
        name: `${NAME_PARTS[i]} ${SECTOR_WORDS[sector.key]} (fictional)`,
        sector: sector.name,
        trueBeta: Math.round((sector.base + (i - 3.5) * 0.06) * 100) / 100,
        residualVol: 0.009 + 0.002 * ((i + s) % 4),
        // The last two names of each sector trade thinly: many days repeat the last price.
        staleShare: i >= 6 ? 0.45 : 0,
        listed: i === 5 && s % 2 === 0 ? '2024-03-11' : undefined,
        delisted: i === 4 && s === 3 ? '2026-05-29' : undefined,
        debtToEquity: Math.round((0.2 + 0.15 * ((i * 3 + s) % 7)) * 100) / 100,
      });
    }
  });
  return out;
}

export const DEMO_FUND = 'Tarn Hollow Partners (fictional)';
export const DEMO_INDEX = 'TARN-BROAD';
