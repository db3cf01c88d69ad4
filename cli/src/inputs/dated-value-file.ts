// Reader for a file holding one dated series: `date,<value>` (the market's own file, the risk-free
// file). Extra columns are allowed when the value column is named. Rows in any order; a repeated
// date is refused.
import { isoOfDayNumber } from '../engine/calendar-date.js';
import { badDate, repeatedDate } from './cell-problems.js';
import type { CellPlace } from './cell-problems.js';
import { visitCsv } from './csv-records.js';
import type { CsvDialect } from './csv-records.js';
import { ascendingOrder, findRepeatedDate, permuteFloat64, permuteInt32 } from './date-order.js';
import { compileDateFormat } from './date-format.js';
import { growableFloat64, growableInt32, pushFloat64, pushInt32, trimmedFloat64, trimmedInt32 } from './growable-array.js';
import { requireColumn } from './header-columns.js';
import { InputError } from './input-error.js';
import { trimPadding } from './number-cell.js';

export interface DatedValueOptions extends CsvDialect {
  readonly dateFormat: string;
  readonly dateColumn: string;
  /** Header name of the value column; when absent the file must have exactly one column besides the date. */
  readonly valueColumn?: string;
}

export interface DatedValues {
  /** Ascending. */
  readonly days: Int32Array;
  readonly values: Float64Array;
  readonly valueColumn: { readonly index: number; readonly name: string };
}

/** Parses one value cell: a number, NaN for an empty cell, or throws an InputError naming `place`. */
export type ValueCellParser = (cell: string, place: CellPlace) => number;

function valueField(file: string, names: readonly string[], dateField: number, options: DatedValueOptions): number {
  if (options.valueColumn !== undefined) return requireColumn(file, names, options.valueColumn, 'INPUT_NO_VALUE_COLUMN', 'value');
  if (names.length !== 2) {
    const reason = `the header has ${names.length} columns: name the value column in the spec`;
    throw new InputError({ code: 'INPUT_NO_VALUE_COLUMN', file, line: 1, column: null, reason });
  }
  return dateField === 0 ? 1 : 0;
}

export async function readDatedValues(file: string, options: DatedValueOptions, parseCell: ValueCellParser): Promise<DatedValues> {
  const format = compileDateFormat(options.dateFormat);
  const days = growableInt32();
  const values = growableFloat64();
  const lines = growableInt32();
  let names: readonly string[] = [];
  let dateField = 0;
  let value = 1;
  await visitCsv(file, options, {
    header(header) {
      names = header;
      dateField = requireColumn(file, names, options.dateColumn, 'INPUT_NO_DATE_COLUMN', 'date');
      value = valueField(file, names, dateField, options);
    },
    row(fields, line) {
      const place = (field: number): CellPlace => ({ file, line, field, columnName: names[field]! });
      const day = format.parse(trimPadding(fields[dateField]!));
      if (Number.isNaN(day)) throw badDate(place(dateField), fields[dateField]!, format);
      pushInt32(days, day);
      pushFloat64(values, parseCell(fields[value]!, place(value)));
      pushInt32(lines, line);
    },
  });
  const fileDays = trimmedInt32(days);
  const order = ascendingOrder(fileDays);
  const repeat = findRepeatedDate(fileDays, order);
  if (repeat !== null) {
    const place = { file, line: lines.data[repeat.repeat]!, field: dateField, columnName: names[dateField]! };
    throw repeatedDate(place, isoOfDayNumber(fileDays[repeat.repeat]!), lines.data[repeat.first]!, '');
  }
  return {
    days: permuteInt32(fileDays, order),
    values: permuteFloat64(trimmedFloat64(values), order),
    valueColumn: { index: value, name: names[value]! },
  };
}
