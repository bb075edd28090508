import { linearisationTable } from '../shared/analysis/image'
const n = 12_000_000
const raw = new Uint8Array(n*4); for (let i=0;i<raw.length;i++) raw[i] = (i*7)&255
const lut = linearisationTable({kind:'srgb'}, 8)
const lr = new Float64Array(256), lg = new Float64Array(256), lb = new Float64Array(256)
const fr = new Float32Array(256), fg = new Float32Array(256), fb = new Float32Array(256)
for (let c=0;c<256;c++){ lr[c]=0.2126*lut[c]; lg[c]=0.7152*lut[c]; lb[c]=0.0722*lut[c]; fr[c]=lr[c]; fg[c]=lg[c]; fb[c]=lb[c] }
const out = new Float32Array(n)
function a(data: Uint8Array) { for (let i = 0, j = 0; i < n; i++, j += 4) out[i] = 0.2126 * lut[data[j]] + 0.7152 * lut[data[j + 1]] + 0.0722 * lut[data[j + 2]] }
function b(data: Uint8Array) { for (let i = 0, j = 0; i < n; i++, j += 4) out[i] = lr[data[j]] + lg[data[j + 1]] + lb[data[j + 2]] }
function c(data: Uint8Array) { for (let i = 0, j = 0; i < n; i++, j += 4) out[i] = fr[data[j]] + fg[data[j + 1]] + fb[data[j + 2]] }
const u32 = new Uint32Array(raw.buffer)
function d() { for (let i = 0; i < n; i++) { const p = u32[i]; out[i] = lr[p & 255] + lg[(p >>> 8) & 255] + lb[(p >>> 16) & 255] } }
function e(data: Uint8Array) { for (let i = 0; i < n; i++) out[i] = lut[data[i*4]] }
for (let k=0;k<4;k++){
  const t0=performance.now(); a(raw); const t1=performance.now(); b(raw); const t2=performance.now(); c(raw); const t3=performance.now(); d(); const t4=performance.now(); e(raw); const t5 = performance.now()
  console.log('a', (t1-t0).toFixed(1), 'b', (t2-t1).toFixed(1), 'c', (t3-t2).toFixed(1), 'd u32', (t4-t3).toFixed(1), 'one lookup', (t5-t4).toFixed(1))
}
