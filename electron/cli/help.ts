/** The usage text printed by --help. */
export const usage = `Ignition Planner on the command line: the conversion checker and the wiring sheet, JSON in and out.

Usage:
  npm run cli -- check <plan.json> [--sweep] [--rpm-points N]
      Check the engine's existing setup and up to three candidates in the plan file; prints the
      comparison report (verdicts, rules with why and what to do, key operating points). --sweep
      adds every rpm point of the sweep: cranking, then round speeds to 110 % of redline with the
      entered idle and redline exactly; --rpm-points sets how many (3 to 2000, default 200).
  npm run cli -- search <bin.json> [--top N] [--rpm-points N]
      Try every module x coil x ballast in the parts bin on the engine; prints the N best (default 5).
  npm run cli -- netlist <plan.json> --rpm R [--candidate N] [--scenario break|fouled|cd|charge] [--coupling K]
      Print an ngspice deck for one setup at R rpm: candidate N (1 to 3; 0 = the existing setup;
      default 1). Run it with: ngspice -b deck.cir
  npm run cli -- checklist <plan.json> [--candidate N] [--format json|html] [--paper a4|letter] [--out FILE]
      Write the wiring sheet for candidate N (1 to 3, default 1): the cautions, the steps in order
      with the terminals, the expected readings with their bands and likely causes, and the wiring
      diagram. --format html writes one printable page (styles inlined, no script) laid out for
      --paper (a4 or letter, default a4). --out writes to FILE instead of printing.
  npm run cli -- export --data-dir DIR [--out FILE]
      Print the whole workshop in DIR (every engine, part, plan, reading and sheet tick) as one
      workshop file (JSON, format "ignition-planner-workshop" version 1); --out writes it to FILE.
  npm run cli -- import <workshop.json> --data-dir DIR [--preview]
      Bring a workshop file into DIR (a new folder gets a new workshop), in one transaction: parts
      matched by kind and name, engines by name, plans by name within their engine; the same record
      is skipped, a different one under a taken name is added as "<name> (imported)". --preview
      prints what would be added, skipped or renamed and writes nothing.
  npm run cli -- backup --data-dir DIR [--list]
      Back up the workshop through SQLite's online backup API into DIR/backups/ (the newest 10 and
      the newest of each month are kept); --list prints every backup with its date and counts.
  npm run cli -- restore <backup-name> --data-dir DIR --yes
      Replace the workshop with a backup named as --list shows it; the current workshop is backed
      up first. --yes confirms.
  npm run cli -- parts-csv export --kind KIND --data-dir DIR [--out FILE]
  npm run cli -- parts-csv import <parts.csv> --kind KIND --data-dir DIR [--preview]
      The parts of one kind (coil, ballast, module, tach, leads or plug) as CSV with the units in the
      headers; an import is all or nothing, every bad cell named as "row N, column: why".
  npm run cli -- --help

Files are described in README.md (section "Command line"); an example is test/fixtures/plan-example.json.
Exit codes: 0 done; 2 the input was refused (the message names the field and why); 1 an internal fault.
`;
