#!/usr/bin/env python3
"""Reference values for lexdelta's metrics module, computed by outside libraries.

Usage: metrics_reference.py OUT_DIR

Generates seeded random graded judgments and runs, writes them to OUT_DIR as TREC qrels,
TREC run files, a CSV judgments file and a queries file, and writes OUT_DIR/expected.json
with the values the reference libraries compute for them:

* ir-measures (with its pytrec-eval-terrier provider, i.e. trec_eval's code, and its own
  msmarco and judged providers for RR@k and Judged@k): P@k, R@k, RR, RR@k, AP, AP@k,
  nDCG, nDCG@k (linear and 2^g-1 gains), Judged@k (lexdelta's JudgedShare@k), at
  relevance thresholds 1 and 2.
  F1@k is derived here from ir-measures' P@k and R@k as 2PR/(P+R).
* rbo (the PyPI package): RBO_ext of random pairs of rankings, even and uneven lengths.
* scipy.stats.permutation_test (exact, paired "samples" permutations): two-sided p-values
  of the paired randomization test.

tests/metrics_reference.rs runs this script and checks lexdelta against the JSON. Needs:
    pip install ir-measures==0.4.3 pytrec-eval-terrier==0.5.11 rbo==0.1.3 scipy==1.17.1
Exits with status 3 and an install hint on stderr when a library is missing.
"""

import csv
import json
import os
import random
import sys
import warnings

INSTALL = "pip install ir-measures==0.4.3 pytrec-eval-terrier==0.5.11 rbo==0.1.3 scipy==1.17.1"

try:
    from importlib.metadata import version

    import ir_measures
    import numpy as np
    import pytrec_eval  # noqa: F401  (the backend ir_measures uses)
    import rbo
    import scipy
    import scipy.stats
    from ir_measures import AP, RR, Judged, P, R, nDCG
except ImportError as e:  # pragma: no cover
    sys.stderr.write(f"missing reference library ({e}); install with:\n    {INSTALL}\n")
    sys.exit(3)

warnings.filterwarnings("ignore")
SEED = 20240611


def make_dataset(rng):
    """Graded judgments and two runs (distinct scores; many tied scores)."""
    qrels, run, ties, texts = {}, {}, {}, {}
    grade_weights = [(-1, 4), (0, 46), (1, 25), (2, 15), (3, 10)]
    grades = [g for g, w in grade_weights for _ in range(w)]
    for i in range(80):
        qid = f"q{i:03d}"
        texts[qid] = f"query text {i}, with a comma"
        kind = i % 16
        pool = [f"d{rng.randrange(10_000)}" for _ in range(rng.randrange(5, 120))]
        pool = list(dict.fromkeys(pool))  # distinct, order kept
        judged_pool = pool[: rng.randrange(1, len(pool) + 1)]
        if kind != 0:  # kind 0: ranked but not judged
            j = {}
            for d in judged_pool:
                g = rng.choice(grades)
                if kind == 1:  # judged, nothing relevant
                    g = min(g, 0)
                j[d] = g
            qrels[qid] = j
        if kind == 2:  # judged, no results
            continue
        ranked = pool[:]
        rng.shuffle(ranked)
        ranked = ranked[: rng.randrange(1, len(ranked) + 1)]
        if kind == 3:  # long run, ideal order first
            ranked = sorted(pool, key=lambda d: -qrels[qid].get(d, -5))
        n = len(ranked)
        run[qid] = {d: float(n - r) + 0.5 for r, d in enumerate(ranked)}
        ties[qid] = {d: round(rng.random() * 2.0, 1) for d in ranked}
    return qrels, run, ties, texts


def write_qrels(path, qrels):
    with open(path, "w") as f:
        for q in sorted(qrels):
            for d, g in qrels[q].items():
                f.write(f"{q} 0 {d} {g}\n")


def write_run(path, run):
    with open(path, "w") as f:
        for q in sorted(run):
            ranked = sorted(run[q].items(), key=lambda x: -x[1])
            for r, (d, s) in enumerate(ranked, 1):
                f.write(f"{q} Q0 {d} {r} {s!r} ref\n")


def write_csv(path, qrels, texts):
    with open(path, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["query_id", "query", "doc_id", "relevance"])
        for q in sorted(qrels):
            for d, g in qrels[q].items():
                w.writerow([q, texts[q], d, g])


def write_queries(path, texts):
    with open(path, "w") as f:
        for q, t in texts.items():
            f.write(f"{q}\t{t}\n")


def per_query(provider, measure, qrels, run):
    out = {m.query_id: float(m.value) for m in provider.iter_calc([measure], qrels, run)}
    return out


def metric_cases(qrels, run, run_file, with_cutoff_rr=True):
    """(lexdelta metric name, threshold, gain, ir_measures measure, provider) tuples."""
    pt, ms, jd = ir_measures.pytrec_eval, ir_measures.msmarco, ir_measures.judged
    exp_gains = {g: (2**g - 1 if g > 0 else 0) for g in range(-1, 4)}
    specs = []
    for rel in (1, 2):
        for k in (1, 5, 10, 20):
            specs.append((f"P@{k}", rel, "linear", P(rel=rel) @ k, pt))
        for k in (1, 5, 10, 100):
            specs.append((f"R@{k}", rel, "linear", R(rel=rel) @ k, pt))
        specs.append(("RR", rel, "linear", RR(rel=rel), pt))
        specs.append(("AP", rel, "linear", AP(rel=rel), pt))
        for k in (10, 100):
            specs.append((f"AP@{k}", rel, "linear", AP(rel=rel) @ k, pt))
        if with_cutoff_rr:
            for k in (1, 3, 10):
                specs.append((f"RR@{k}", rel, "linear", RR(rel=rel) @ k, ms))
    for k in (1, 3, 5, 10, 20):
        specs.append((f"nDCG@{k}", 1, "linear", nDCG @ k, pt))
        specs.append((f"nDCG@{k}", 1, "exponential", nDCG(gains=exp_gains) @ k, pt))
    specs.append(("nDCG", 1, "linear", nDCG, pt))
    specs.append(("nDCG", 1, "exponential", nDCG(gains=exp_gains), pt))
    if with_cutoff_rr:
        for k in (5, 10):
            specs.append((f"JudgedShare@{k}", 1, "linear", Judged @ k, jd))

    cases = []
    for name, rel, gain, measure, provider in specs:
        values = per_query(provider, measure, qrels, run)
        cases.append(
            {
                "run": run_file,
                "metric": name,
                "relevance_threshold": rel,
                "gain": gain,
                "reference": f"ir_measures {provider.NAME} {measure}",
                "per_query": values,
                "mean": sum(values.values()) / len(values),
            }
        )
    # F1@k from the reference P@k and R@k.
    if with_cutoff_rr:
        for rel in (1, 2):
            for k in (5, 10):
                p = per_query(pt, P(rel=rel) @ k, qrels, run)
                r = per_query(pt, R(rel=rel) @ k, qrels, run)
                f1 = {q: (2 * p[q] * r[q] / (p[q] + r[q]) if p[q] + r[q] > 0 else 0.0) for q in p}
                cases.append(
                    {
                        "run": run_file,
                        "metric": f"F1@{k}",
                        "relevance_threshold": rel,
                        "gain": "linear",
                        "reference": "2PR/(P+R) of ir_measures pytrec_eval P@k, R@k",
                        "per_query": f1,
                        "mean": sum(f1.values()) / len(f1),
                    }
                )
    return cases


def rbo_cases(rng):
    cases = []
    items = [f"i{n}" for n in range(40)]
    for n in range(120):
        la, lb = rng.randrange(1, 25), rng.randrange(1, 25)
        if n % 3 == 0:
            lb = la  # even lengths
        a = rng.sample(items, la)
        if n % 5 == 0:  # b: a lightly perturbed copy of a, for high overlap
            b = a[:]
            for _ in range(2):
                x, y = rng.randrange(la), rng.randrange(la)
                b[x], b[y] = b[y], b[x]
            b = b[:lb] + [i for i in items if i not in b][: max(0, lb - la)]
        else:
            b = rng.sample(items, lb)
        p = [0.5, 0.8, 0.9, 0.95, 0.98][n % 5]
        value = rbo.RankingSimilarity(a, b).rbo_ext(p=p)
        cases.append({"a": a, "b": b, "p": p, "value": float(value)})
    return cases


def significance_cases(rng):
    cases = []
    for n in range(40):
        size = rng.randrange(2, 15)
        if n % 2 == 0:
            # Multiples of 1/8 are exact in binary: many exact ties among assignments.
            before = [rng.randrange(9) / 8 for _ in range(size)]
            after = [min(1.0, max(0.0, b + rng.randrange(-3, 4) / 8)) for b in before]
        else:
            before = [rng.random() for _ in range(size)]
            after = [min(1.0, max(0.0, b + rng.gauss(0.05, 0.2))) for b in before]
            for i in range(0, size, 4):
                after[i] = before[i]  # some zero differences
        if all(a == b for a, b in zip(after, before)):
            p_value = 1.0
        else:
            res = scipy.stats.permutation_test(
                (np.array(after), np.array(before)),
                lambda x, y, axis: np.mean(x - y, axis=axis),
                permutation_type="samples",
                n_resamples=np.inf,
                alternative="two-sided",
                vectorized=True,
            )
            p_value = float(res.pvalue)
        cases.append({"before": before, "after": after, "p_value": p_value})
    return cases


def main():
    if len(sys.argv) != 2:
        sys.stderr.write("usage: metrics_reference.py OUT_DIR\n")
        return 2
    out = sys.argv[1]
    os.makedirs(out, exist_ok=True)
    rng = random.Random(SEED)
    qrels, run, ties, texts = make_dataset(rng)
    write_qrels(os.path.join(out, "judgments.qrels"), qrels)
    write_run(os.path.join(out, "distinct.run"), run)
    write_run(os.path.join(out, "ties.run"), ties)
    write_csv(os.path.join(out, "judgments.csv"), qrels, texts)
    write_queries(os.path.join(out, "queries.tsv"), texts)

    # The reference libraries read the same files lexdelta reads.
    qrels_ref = {}
    for q in ir_measures.read_trec_qrels(os.path.join(out, "judgments.qrels")):
        qrels_ref.setdefault(q.query_id, {})[q.doc_id] = q.relevance
    cases = metric_cases(qrels_ref, run, "distinct.run")
    # Tied scores: only trec_eval's own code (pytrec_eval), whose tie order lexdelta follows.
    cases += metric_cases(qrels_ref, ties, "ties.run", with_cutoff_rr=False)

    expected = {
        "seed": SEED,
        "libraries": {
            **{name: version(name) for name in ("ir-measures", "pytrec-eval-terrier", "rbo")},
            "scipy": scipy.__version__,
            "numpy": np.__version__,
        },
        "judged_queries": sorted(qrels_ref),
        "metrics": cases,
        "rbo": rbo_cases(rng),
        "significance": significance_cases(rng),
    }
    with open(os.path.join(out, "expected.json"), "w") as f:
        json.dump(expected, f, indent=1)
    return 0


if __name__ == "__main__":
    sys.exit(main())
