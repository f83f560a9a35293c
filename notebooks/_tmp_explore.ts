import Papa from "papaparse";
import { blandAltman, repeatability, intraclassCorrelations, concordanceCorrelation, demingRegression, passingBablokRegression, cohenKappa, fleissKappa, blandAltmanRepeated } from "../mod.ts";
const csv = await Deno.readTextFile("../examples/data/validation-demo.csv");
const p = Papa.parse(csv, { header: true, skipEmptyLines: true });
const rows = p.data as Record<string,string>[];
const get = (obs: string, rep: number) => rows.filter(r => r.observer === obs && Number(r.replicate) === rep).map(r => Number(r.lvef_percent));
const A1 = get("sonographer_A",1), B1 = get("sonographer_B",1), T1 = get("auto_trace",1);
const A2 = get("sonographer_A",2), B2 = get("sonographer_B",2), T2 = get("auto_trace",2);
for (const [n,x,y] of [["T-A",T1,A1],["T-B",T1,B1],["A-B",A1,B1]] as const) {
  const r = blandAltman(x,y); console.log(n, r.bias, r.sdDifferences, r.lowerLimit.value, r.upperLimit.value, r.proportionalBias);
}
for (const [n,a,b] of [["A",A1,A2],["B",B1,B2],["T",T1,T2]] as const) console.log(n, repeatability(a.map((v,i)=>[v,b[i]!])));
console.log(JSON.stringify(intraclassCorrelations(A1.map((v,i)=>[v,B1[i]!,T1[i]!])).forms.map(f=>[f.form,f.value,f.ci])));
console.log(concordanceCorrelation(A1,T1));
console.log(demingRegression(A1,T1), passingBablokRegression(A1,T1));
console.log(Math.min(...A1), Math.max(...A1));
const g = Papa.parse(await Deno.readTextFile("../examples/data/validation-grades.csv"), { header: true, skipEmptyLines: true }).data as Record<string,string>[];
const r = (k: string) => g.filter(x => x.reader === k).map(x => x.mr_grade!);
const cats = ["none","mild","moderate","severe"];
console.log(cohenKappa(r("reader_1"), r("reader_2"), {categories: cats}));
console.log(cohenKappa(r("reader_1"), r("reader_2"), {categories: cats, weights: "quadratic"}).kappa);
