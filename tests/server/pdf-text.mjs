// Reads a PDF from stdin with pdf-parse and prints { total, text, pages: [{ num, text }] } as JSON.
// Run as its own Node process: pdf.js loads its worker by dynamic import, which Jest's VM does not allow.
import { PDFParse } from 'pdf-parse';

const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const parser = new PDFParse({ data: new Uint8Array(Buffer.concat(chunks)) });
const out = await parser.getText();
await parser.destroy();
process.stdout.write(JSON.stringify({ total: out.total, text: out.text, pages: out.pages.map((p) => ({ num: p.num, text: p.text })) }));
