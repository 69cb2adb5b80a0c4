import { writeFileSync } from 'node:fs';
import { runStudy, toSI } from '@basinwright/common';
import { fenwickDesign } from './seed/designs';
import { renderProposal } from './api/src/modules/proposals/proposal.render';
const result = runStudy(toSI(fenwickDesign));
const paid = process.argv[2] === 'paid';
const t = Date.now();
const { pdf, pages } = await renderProposal({
  firm: { name: 'Harrow & Lune Engineering', plan: paid ? 'firm' : 'concept', brand: paid ? { color: '#0f6e6e', logo: null, footer: null } : null, sealStatement: null },
  project: { name: 'Fenwick Mill Pond — auxiliary spillway outlet', client: 'Fenwick Mill Pond Trust', location: 'Harrowdale', units: 'SI' },
  version: { number: 1, input: fenwickDesign, result, engineVersion: '2.2.0', computedAt: new Date(), issuedByName: 'Priya Okonjo-Vale', issuedAt: new Date(), note: '' },
  review: paid ? { state: 'approved', reviewedByName: 'Morwenna Harrow', reviewedAt: new Date(), licence: 'PE-1234', jurisdiction: 'Harrowdale', statement: 'I have reviewed this concept design.' } : { state: 'not_sent', reviewedByName: null, reviewedAt: null, licence: null, jurisdiction: null, statement: null },
  generatedAt: new Date(),
}, 40);
console.log('pages', pages, 'ms', Date.now() - t);
writeFileSync(`/tmp/proposal-${paid ? 'paid' : 'concept'}.pdf`, pdf);
