import { downsampleBox, edgeMap, findSegments, findEdges } from '../shared/analysis/edge'
import { toGreyImage } from '../shared/analysis/image'
import { renderTargetFrame } from '../tests/fixtures/edges/frame'
const f = renderTargetFrame({width:4000,height:3000,sigmaPx:1.5, snr: 100, seed: 1})
const raw = new Uint8Array(4000*3000*4); for (let i=0;i<f.codes.length;i++){raw[4*i]=raw[4*i+1]=raw[4*i+2]=f.codes[i]; raw[4*i+3]=255}
for (let i=0;i<6;i++){
 let t=performance.now(); const img = toGreyImage({width:4000,height:3000,data:raw,channels:4,bitDepth:8}); const t0=performance.now()
 const small = downsampleBox(img, 4); const t1=performance.now()
 const map = edgeMap(small, 0.06); const t2=performance.now()
 const segs = findSegments(map, 8); const t3=performance.now()
 const e = findEdges(img); const t4=performance.now()
 console.log('lum',(t0-t).toFixed(1),'ds',(t1-t0).toFixed(1),'map',(t2-t1).toFixed(1),'segs',(t3-t2).toFixed(1), segs.segments.length,'findEdges',(t4-t3).toFixed(1), e.length)
}
