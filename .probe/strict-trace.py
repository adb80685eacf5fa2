# makes .probe/solve.trace.ts from lib/award/solve.ts with a [strict] line per step and per MIP
s=open('lib/award/solve.ts').read()
s=s.replace("""        certificates.push(certificate);""","""        certificates.push(certificate);
        console.error(`[strict] k=${k} best=${best[k]!.toFixed(3)} had=${had.toFixed(3)} ${certificate.method} score=${certificate.score.toFixed(3)} bound=${certificate.bound?.toFixed(3)} t=${(performance.now()/1000).toFixed(1)}`);""")
s=s.replace("""      let mip = clock.phase(`${phase}-mip`, () => master.solveMip(limit, stop, 1e-9, start, target?.value));""","""      const __t = performance.now();
      let mip = clock.phase(`${phase}-mip`, () => master.solveMip(limit, stop, 1e-9, start, target?.value));
      if (phase==="strict"||phase==="probe") console.error(`  [mip ${phase}] ${mip.status} obj=${mip.objective?.toFixed(4)} target=${target?.value?.toFixed(4)} lim=${limit.toFixed(1)} took=${((performance.now()-__t)/1000).toFixed(1)}`);""")
s=s.replace("""          if (step.lp.status === "infeasible")""","""          console.error(`  [probe] k=${k} target=${target.toFixed(4)} bound=${step.bound.toFixed(4)} limit=${coverageLimit.toFixed(4)} lp=${step.lp.objective.toFixed(4)} exhausted=${step.exhausted}`);
          if (step.lp.status === "infeasible")""")
open('.probe/solve.trace.ts','w').write(s)
