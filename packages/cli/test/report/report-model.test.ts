import { describe, expect, it } from 'vitest';
import { buildReportModel } from '../../src/report/report-model.js';
import { agreesToThreeDigits, loadExample, M3S_PER_CFM, MS_PER_FPM, PA_PER_INHG, W_PER_HP } from './example-reports.js';

// The report model of the bundled examples: every number it prints is the
// analysis's, converted with NIST SP 811 factors (not the engine's unit
// table) and shown to three significant digits.

const AT = new Date('2025-05-01T10:00:00Z');

describe('report model of the harbour offices example', () => {
  it('title block: the system name, the file, the time in UTC and the version', async () => {
    const input = await loadExample('harbour-offices');
    const report = buildReportModel(input, { generatedAt: AT, version: '9.9.9' });
    expect(report.title).toBe('Harbour offices, five floors over a basement');
    expect(report.file).toBe('examples/harbour-offices.vacnet');
    expect(report.generatedAt).toBe('2025-05-01T10:00:00.000Z');
    expect(report.generatedAtText).toBe('2025-05-01 10:00 UTC');
    expect(report.version).toBe('9.9.9');
    expect(report.units).toBe('imperial');
    expect(report.analysed).toBe(true);
  });

  it('summary: producer point, margin and powers in inHg, scfm and hp (NIST SP 811 factors)', async () => {
    const input = await loadExample('harbour-offices');
    const p = input.analysis!.producer!;
    const s = buildReportModel(input, { generatedAt: AT }).summary.producer!;
    expect(s.flow).toMatch(/ scfm$/);
    expect(agreesToThreeDigits(s.flow, p.flowStdM3PerS / M3S_PER_CFM)).toBe(true);
    expect(s.vacuum).toMatch(/ inHg$/);
    expect(agreesToThreeDigits(s.vacuum, p.vacuumPa / PA_PER_INHG)).toBe(true);
    expect(agreesToThreeDigits(s.airPower, p.airPowerW / W_PER_HP)).toBe(true);
    expect(agreesToThreeDigits(s.shaftPower!, p.shaftPowerW! / W_PER_HP)).toBe(true);
    expect(s.margin).toBe(`+${Math.round(p.marginFraction! * 100)} % on flow`);
    // The file asks for 15 % ("margin 15 %").
    expect(s.requiredMargin).toBe('15 % on flow');
    expect(s.marginMet).toBe(p.marginFraction! >= 0.15);
  });

  it('worst inlet: the design case critical inlet, its tool vacuum, need and partners', async () => {
    const input = await loadExample('harbour-offices');
    const a = input.analysis!;
    const w = buildReportModel(input, { generatedAt: AT }).summary.worstInlet!;
    expect(w.name).toBe(a.designCase!.criticalInlet);
    const wc = a.inlets.find((i) => i.name === w.name)!.worstCase!;
    expect(agreesToThreeDigits(w.toolVacuum, wc.toolVacuumPa / PA_PER_INHG)).toBe(true);
    // The carpet tool needs 3 inHg (examples/catalog/equipment.vacnet).
    expect(w.need).toBe('3.00 inHg');
    expect(w.others).toEqual(wc.openInlets.filter((n) => n !== w.name));
    expect(w.band).toBe(wc.toolVacuumPa < 3 * PA_PER_INHG ? 'short' : wc.toolVacuumPa < 3.3 * PA_PER_INHG ? 'tight' : 'ample');
  });

  it('inlet table: one row per inlet in file order, every figure from the worst case', async () => {
    const input = await loadExample('harbour-offices');
    const rows = buildReportModel(input, { generatedAt: AT }).inlets;
    expect(rows.map((r) => r.name)).toEqual(input.model.inlets.map((i) => i.name));
    for (const row of rows) {
      const wc = input.analysis!.inlets.find((i) => i.name === row.name)!.worstCase!;
      expect(agreesToThreeDigits(row.toolVacuum, wc.toolVacuumPa / PA_PER_INHG), row.name).toBe(true);
      expect(agreesToThreeDigits(row.inletVacuum, wc.inletVacuumPa / PA_PER_INHG), row.name).toBe(true);
      expect(agreesToThreeDigits(row.hoseLoss, wc.hoseLossPa / PA_PER_INHG), row.name).toBe(true);
      expect(agreesToThreeDigits(row.flow, wc.flowStdM3PerS / M3S_PER_CFM), row.name).toBe(true);
      // The tool vacuum is the valve vacuum less the hose loss (analysis-types.ts), checked on the printed figures.
      expect(Math.abs(parseFloat(row.inletVacuum) - parseFloat(row.hoseLoss) - parseFloat(row.toolVacuum))).toBeLessThan(0.015);
      expect(row.others).not.toContain(row.name);
      expect(row.others).toHaveLength(2); // three design operators ("operators 3")
    }
    expect(rows.find((r) => r.name === 'W1a')!.room).toBe('Reception and cafe');
    expect(rows.filter((r) => r.critical).map((r) => r.name)).toEqual([input.analysis!.designCase!.criticalInlet]);
  });

  it('pipe table: velocities in fpm, sizes as the trade writes them', async () => {
    const input = await loadExample('harbour-offices');
    const rows = buildReportModel(input, { generatedAt: AT }).pipes;
    expect(rows).toHaveLength(input.model.pipes.length);
    const main1 = rows.find((r) => r.name === 'main-1')!;
    const a = input.analysis!.pipes.find((p) => p.name === 'main-1')!;
    expect(main1.size).toBe('3 in'); // "size 3 in" in the file
    expect(main1.length).toBe('40.0 ft'); // "length 40 ft"
    expect(agreesToThreeDigits(main1.minVelocity, a.minVelocityMPerS! / MS_PER_FPM)).toBe(true);
    expect(agreesToThreeDigits(main1.maxVelocity, a.maxVelocityMPerS! / MS_PER_FPM)).toBe(true);
    expect(main1.minVelocityInlet).toBe(a.minVelocityInlet);
    expect(rows.find((r) => r.name === 'riser-w1')!.size).toBe('2-1/2 in');
    // ASME B36.10M: 2-1/2 NPS schedule 10 has a 2.635 in bore.
    expect(rows.find((r) => r.name === 'riser-w1')!.insideDiameter).toBe('2.63 in');
  });

  it('commissioning sheet: the 5/8 in test orifice, a gauge reading per inlet, the partners holding orifices', async () => {
    const input = await loadExample('harbour-offices');
    const sheet = buildReportModel(input, { generatedAt: AT }).commissioning!;
    expect(sheet.orifice).toBe('5/8 in'); // "test-orifice 5/8 in"
    expect(sheet.rows.map((r) => r.name)).toEqual(input.analysis!.commissioning!.inlets.map((i) => i.name));
    for (const row of sheet.rows) {
      const p = input.analysis!.commissioning!.inlets.find((i) => i.name === row.name)!;
      expect(agreesToThreeDigits(row.expectedGauge, p.gaugeVacuumPa / PA_PER_INHG)).toBe(true);
      expect(row.withOrificesIn).toEqual(p.openInlets.filter((n) => n !== row.name));
    }
  });

  it('accepted findings: each with the reason the file gives', async () => {
    const input = await loadExample('harbour-offices');
    const accepted = buildReportModel(input, { generatedAt: AT }).accepted;
    const main1 = accepted.find((a) => a.element === 'pipe main-1')!;
    expect(main1.code).toBe('slow-carrying-velocity');
    expect(main1.reason).toMatch(/^every operator's air passes here/);
    expect(main1.title).toBe('Carrying velocity too low with one operator');
  });

  it('no dust caution where the file declares no combustible dust; the general cautions always', async () => {
    const report = buildReportModel(await loadExample('harbour-offices'), { generatedAt: AT });
    expect(report.cautions.dust).toBeNull();
    expect(report.cautions.general.join(' ')).toMatch(/do not replace a licensed engineer/);
    expect(report.cautions.general.join(' ')).toMatch(/High vacuum can injure/);
  });
});

describe('report model of other examples', () => {
  it('combustible metal dust: the caution defers to NFPA 652, 654, 484 (NFPA 660) and the authority having jurisdiction', async () => {
    const report = buildReportModel(await loadExample('grinding-plant'), { generatedAt: AT });
    const text = report.cautions.dust!.join(' ');
    for (const words of ['NFPA 652', 'NFPA 654', 'NFPA 484', 'NFPA 660', 'authority having jurisdiction', 'dust hazard analysis']) expect(text).toContain(words);
    expect(report.designBasis.find((r) => r.label === 'Combustible dust')!.value).toMatch(/^combustible metal dust; bonding and grounding declared/);
  });

  it('design operators derived from floor areas are explained with rates and the window', async () => {
    const input = await loadExample('primary-school');
    const row = buildReportModel(input, { generatedAt: AT }).designBasis.find((r) => r.label === 'Design operators')!;
    expect(row.value).toBe(String(input.analysis!.operators.count));
    expect(row.note).toMatch(/^from the floor areas: carpet .* ft2 at .* ft2\/h/);
    expect(row.note).toMatch(/rounded up$/);
  });

  it('a system-wide acceptance is listed once with the number of findings it covers', async () => {
    const input = await loadExample('detached-house');
    const accepted = buildReportModel(input, { generatedAt: AT }).accepted;
    const systemWide = accepted.filter((a) => a.element.startsWith('whole system'));
    expect(systemWide).toHaveLength(1);
    const covered = input.accepted!.filter((a) => a.scope === 'system').length;
    expect(systemWide[0]!.element).toBe(`whole system (${covered} findings)`);
  });

  it('a file with an error: findings and layout, no analysis figures, and a note saying why', async () => {
    const input = await loadExample('unresolved-hose');
    const report = buildReportModel(input, { generatedAt: AT });
    expect(report.analysed).toBe(false);
    expect(report.counts.errors).toBe(1);
    expect(report.findings[0]).toMatchObject({ severity: 'error', code: 'unresolved-reference' });
    expect(report.analysisNote).toMatch(/once the errors .* are fixed/);
    expect(report.curve).toBeNull();
    expect(report.inlets).toEqual([]);
    expect(report.schematic!.nodes.filter((n) => n.kind === 'inlet').map((n) => n.name)).toEqual(['kitchen']);
    expect(report.schematic!.hasResults).toBe(false);
  });

  it('no model at all: a report of the findings alone, titled by the file', () => {
    const report = buildReportModel({
      path: 'broken.vacnet',
      diagnostics: [{ severity: 'error', code: 'syntax-error', message: 'Expecting a name.', range: { start: { line: 2, character: 4 }, end: { line: 2, character: 5 } }, source: 'syntax' }],
    });
    expect(report.title).toBe('broken.vacnet');
    expect(report.findings).toEqual([expect.objectContaining({ code: 'syntax-error', line: 3, column: 5 })]);
    expect(report.schematic).toBeNull();
    expect(report.designBasis).toEqual([]);
  });

  it('findings: errors, then warnings, then infos, each in file order', () => {
    const at = (line: number) => ({ start: { line, character: 0 }, end: { line, character: 1 } });
    const report = buildReportModel({
      path: 'x.vacnet',
      diagnostics: [
        { severity: 'info', code: 'c', message: 'i1', range: at(1), source: 'engine' },
        { severity: 'warning', code: 'b', message: 'w9', range: at(9), source: 'engine' },
        { severity: 'error', code: 'a', message: 'e5', range: at(5), source: 'structure' },
        { severity: 'warning', code: 'b', message: 'w2', range: at(2), source: 'engine' },
      ],
    });
    expect(report.findings.map((f) => f.message)).toEqual(['e5', 'w2', 'w9', 'i1']);
    expect(report.counts).toEqual({ errors: 1, warnings: 2, infos: 1, accepted: 0 });
  });
});
