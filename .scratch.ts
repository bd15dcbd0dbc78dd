import { cardboardFor } from "./lib/calc/cardboard";
import { polygonArea } from "./lib/calc/area";
import { destination, point } from "@turf/turf";
// rectangle 4 x 2 m at lat 51, rotated 30 deg
function rectPoly(L:number,W:number,rot:number,lat=51,lng=0){
  const o=point([lng,lat]);
  const pts=[[0,0],[L,0],[L,W],[0,W]].map(([x,y])=>{const xr=x*Math.cos(rot)-y*Math.sin(rot), yr=x*Math.sin(rot)+y*Math.cos(rot);
    const d=Math.hypot(xr,yr); const b=90-Math.atan2(yr,xr)*180/Math.PI; return d===0?[lng,lat]:destination(o,d/1000,b).geometry.coordinates});
  return {type:"Polygon" as const, coordinates:[[...pts,pts[0]]]};
}
for (const rot of [0,0.5,1.2]) { const p=rectPoly(4,2,rot); console.log(rot, polygonArea(p), cardboardFor({polygon:p}), cardboardFor({length_m:4,width_m:2})); }
const t0=Date.now(); const big=rectPoly(100,100,0.3); console.log(cardboardFor({polygon:big}), cardboardFor({length_m:100,width_m:100}), Date.now()-t0,"ms");
