// Append-only typed arrays that double their capacity, so readers store numbers straight into typed
// memory while streaming rows of unknown count.

export interface GrowableFloat64 {
  data: Float64Array;
  length: number;
}

export interface GrowableInt32 {
  data: Int32Array;
  length: number;
}

export function growableFloat64(capacity = 256): GrowableFloat64 {
  return { data: new Float64Array(capacity), length: 0 };
}

export function growableInt32(capacity = 256): GrowableInt32 {
  return { data: new Int32Array(capacity), length: 0 };
}

export function pushFloat64(array: GrowableFloat64, value: number): void {
  if (array.length === array.data.length) {
    const bigger = new Float64Array(Math.max(16, array.data.length * 2));
    bigger.set(array.data);
    array.data = bigger;
  }
  array.data[array.length++] = value;
}

export function pushInt32(array: GrowableInt32, value: number): void {
  if (array.length === array.data.length) {
    const bigger = new Int32Array(Math.max(16, array.data.length * 2));
    bigger.set(array.data);
    array.data = bigger;
  }
  array.data[array.length++] = value;
}

/** The filled part as an array of its own (the spare capacity is released). */
export function trimmedFloat64(array: GrowableFloat64): Float64Array {
  return array.data.slice(0, array.length);
}

export function trimmedInt32(array: GrowableInt32): Int32Array {
  return array.data.slice(0, array.length);
}
