/** The usage text printed by --help. */
export const usage = `Ignition Planner on the command line: the conversion checker and the wiring sheet, JSON in and out.

Usage:
  npm run cli -- check <plan.json> [--sweep] [--rpm-points N]
      Check the engine's existing setup and up to three candidates in the plan file; prints the
      comparison report (verdicts, rules with why and what to do, key operating points). --sweep
      adds every rpm point of the sweep: cranking, then round speeds to 110 % of redline with the
      entered idle and redline exactly; --rpm-points sets how many (2 to 2000, default 200).
  npm run cli -- search <bin.json> [--top N] [--rpm-points N]
      Try every module x coil x ballast in the parts bin on the engine; prints the N best (default 5).
  npm run cli -- netlist <plan.json> --rpm R [--candidate N] [--scenario break|fouled|cd|charge] [--coupling K]
      Print an ngspice deck for one setup at R rpm: candidate N (1 to 3; 0 = the existing setup;
      default 1). Run it with: ngspice -b deck.cir
  npm run cli -- checklist <plan.json> [--candidate N] [--format json|html] [--out FILE]
      Write the wiring sheet for candidate N (1 to 3, default 1): the cautions, the steps in order
      with the terminals, the expected readings with their bands and likely causes, and the wiring
      diagram. --format html writes one printable page (styles inlined, no script). --out writes
      to FILE instead of printing.
  npm run cli -- --help

Files are described in README.md (section "Command line"); an example is test/fixtures/plan-example.json.
Exit codes: 0 done; 2 the input was refused (the message names the field and why); 1 an internal fault.
`;
