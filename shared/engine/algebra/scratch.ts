// Typed arrays for the temporaries of long computations (a radix sort's passes, a term table's
// slots), reused from call to call. A fresh array of a few megabytes costs its allocation and a
// first touch of every page, which on some machines costs more than the work done in it; a
// reused one costs neither. Each caller names its own slot; what a slot holds is valid until the
// slot is asked for again, and is not zeroed.

const slots = new Map<string, ArrayBuffer>();

function bufferFor(slot: string, bytes: number): ArrayBuffer {
  let b = slots.get(slot);
  if (b === undefined || b.byteLength < bytes) {
    // Grow by half again as much, so a run of growing sizes reallocates a few times only.
    b = new ArrayBuffer(Math.max(bytes, Math.ceil((b?.byteLength ?? 0) * 1.5)));
    slots.set(slot, b);
  }
  return b;
}

export function scratchFloat64(slot: string, n: number): Float64Array {
  return new Float64Array(bufferFor(slot, n * 8), 0, n);
}

export function scratchUint32(slot: string, n: number): Uint32Array {
  return new Uint32Array(bufferFor(slot, n * 4), 0, n);
}

export function scratchUint8(slot: string, n: number): Uint8Array {
  return new Uint8Array(bufferFor(slot, n), 0, n);
}
