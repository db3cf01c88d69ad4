import { z } from 'zod';
import { columnName, dateFormat, delimiter, filePattern, rate } from './run-spec.fields.js';

/** The `inputs` section of the run spec: which drop-folder files feed a run, and how to read them. */

const fileReading = {
  dateColumn: columnName.default('date').describe('Header of the date column.'),
  delimiter: delimiter.default(',').describe('Field separator: one character (write a tab as "\\t").'),
  dateFormat: dateFormat
    .default('YYYY-MM-DD')
    .describe('How dates are written, with the tokens YYYY, MM and DD (e.g. DD/MM/YYYY, YYYYMMDD).'),
};

const pricesSchema = z
  .strictObject({
    pattern: filePattern.describe('File-name pattern (glob) of the price file in the drop folder; a matching file triggers a run.'),
    layout: z
      .enum(['wide', 'long'])
      .default('wide')
      .describe('wide: one column per security (date,<code>,<code>,…); long: one row per date and security (date,security,close).'),
    securityColumn: columnName.default('security').describe('Long layout: header of the security-code column.'),
    closeColumn: columnName.default('close').describe('Long layout: header of the adjusted-close column.'),
    ...fileReading,
  })
  .describe('The price file: total-return adjusted closes of the securities.');

const marketInPrices = z.strictObject({
  source: z.literal('price-file').describe('price-file: the market is a series inside the price file; own-file: a file of its own.'),
  column: columnName.describe('The market\'s column in a wide price file, or its security code in a long one; with own-file, the level column of the market file.'),
});

const marketOwnFile = z.strictObject({
  source: z.literal('own-file').describe('price-file: the market is a series inside the price file; own-file: a file of its own.'),
  pattern: filePattern.describe('own-file: file-name pattern of the market file; the newest match in incoming/ or archive/ is used.'),
  column: columnName.describe('The market\'s column in a wide price file, or its security code in a long one; with own-file, the level column of the market file.'),
  ...fileReading,
});

const marketSchema = z
  .discriminatedUnion('source', [marketInPrices, marketOwnFile])
  .describe('The market index, as a series of the price file or as its own file.');

const riskFreeFile = z.strictObject({
  source: z.literal('file').describe('file: an annual-yield series from a file; constant: one annual yield for every period.'),
  pattern: filePattern.describe('file: file-name pattern of the risk-free file; the newest match in incoming/ or archive/ is used.'),
  column: columnName.describe('Header of the annual-yield column.'),
  unit: z
    .enum(['percent', 'decimal'])
    .default('percent')
    .describe('How the file writes the yield: percent (3.25 is 3.25%) or decimal (0.0325).'),
  ...fileReading,
});

const riskFreeConstant = z.strictObject({
  source: z.literal('constant').describe('file: an annual-yield series from a file; constant: one annual yield for every period.'),
  annualYield: rate.describe('The constant annual yield as a decimal (0.03 is 3%).'),
});

const riskFreeSchema = z
  .discriminatedUnion('source', [riskFreeFile, riskFreeConstant])
  .describe('The risk-free rate: an annual-yield file or a constant yield.');

export const inputsSchema = z
  .strictObject({
    prices: pricesSchema,
    market: marketSchema,
    riskFree: riskFreeSchema,
  })
  .describe('The input files of a run and how to read them.');
