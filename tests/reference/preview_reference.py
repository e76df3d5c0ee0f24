#!/usr/bin/env python3
"""Outside references for what `lexdelta preview` prints: judged metrics computed by
trec_eval's own code from lexdelta's run files, and BM25 and cosine scores computed by
general-purpose Python libraries from the same collection.

Usage:
  preview_reference.py generate DIR SEED
      Writes a seeded random collection built to produce tied scores: DIR/corpus.jsonl
      (short documents over a small vocabulary, a third of them exact copies of another
      document under another id), DIR/queries.tsv (`query<TAB>count`),
      DIR/judged-queries.tsv and DIR/judgments.qrels (every query judged, relevant
      documents often tied with non-relevant copies), and two rulesets: DIR/base (no
      stemmer, no stopwords, so a key is the lowercased token) and DIR/head (the same plus
      synonym rules, so rankings change).
  preview_reference.py metrics QRELS JUDGED_QUERIES RUN DEPTH
      Prints JSON: per judged query (every id of JUDGED_QUERIES that QRELS judges) the
      values of P@10, nDCG@10, R@DEPTH, AP@DEPTH and RR computed by ir-measures with its
      pytrec-eval-terrier provider (trec_eval's code) from the TREC run file RUN, and their
      means. A judged query absent from RUN scores 0 and counts in the means (trec_eval -c).
  preview_reference.py scores CORPUS FIELD QUERIES_TSV JUDGED_QUERIES
      Prints JSON: for every judged query, the BM25 score of every document that contains a
      query term, by bm25s 0.3.16 (method "atire" for the term-frequency part,
      tf*(k1+1)/(tf + k1*(1-b+b*dl/avgdl)), with its BM25L idf, ln((N+1)/(df+0.5)), which
      equals ln(1 + (N-df+0.5)/(df+0.5)); k1 = 1.2, b = 0.75, float64), and the cosine score by
      scikit-learn 1.9.1 (TfidfTransformer with sublinear_tf, i.e. 1 + ln tf, L2-normalized,
      its idf set to ln(N/df)): the sum of the normalized document weights of the query's
      terms. Documents and queries are split on whitespace (the rulesets above make a key
      the lowercased token).

tests/preview_reference.rs drives this script and compares lexdelta against it.
"""

import json
import random
import sys

INSTALL = ("pip install ir-measures==0.4.3 pytrec-eval-terrier==0.5.11 bm25s==0.3.16 "
           "scikit-learn==1.9.1")

try:
    import ir_measures
    import numpy as np
    from ir_measures import AP, RR, P, R, nDCG
except ImportError as e:  # pragma: no cover
    sys.stderr.write(f"missing reference library ({e}); install with:\n    {INSTALL}\n")
    sys.exit(3)


def words(rng, n):
    """n distinct lowercase words of two or three syllables."""
    syllables = ["ba", "ko", "ri", "ten", "mu", "sa", "lo", "vy", "de", "pa", "zu", "ne"]
    out = set()
    while len(out) < n:
        out.add("".join(rng.choice(syllables) for _ in range(rng.choice([2, 3]))))
    return sorted(out)


def generate(out, seed):
    rng = random.Random(seed)
    vocab = words(rng, 40)
    docs = []
    for i in range(240):
        n = rng.choice([1, 2, 2, 3, 4, 6, 9])
        body = " ".join(rng.choice(vocab[: 10 + i % 30]) for _ in range(n))
        title = " ".join(rng.sample(vocab, 2))
        docs.append({"title": title, "body": body})
    # A third of the documents again, under other ids: equal texts, equal scores.
    docs += [dict(d) for d in rng.sample(docs, 120)]
    ids = rng.sample(range(10_000, 100_000), len(docs))
    for d, i in zip(docs, ids):
        d["id"] = f"doc-{i}"
    rng.shuffle(docs)
    with open(f"{out}/corpus.jsonl", "w") as f:
        for d in docs:
            f.write(json.dumps({"id": d["id"], "title": d["title"], "body": d["body"]}) + "\n")

    queries = set()
    while len(queries) < 60:
        queries.add(" ".join(rng.sample(vocab[:25], rng.choice([1, 1, 2, 2, 3]))))
    queries = sorted(queries)
    with open(f"{out}/queries.tsv", "w") as f:
        for q in queries:
            f.write(f"{q}\t{rng.randrange(1, 500)}\n")
    with open(f"{out}/judged-queries.tsv", "w") as f, open(f"{out}/judgments.qrels", "w") as j:
        for n, q in enumerate(queries):
            qid = f"t{n:03d}"
            f.write(f"{qid}\t{q}\n")
            terms = set(q.split())
            containing = [d["id"] for d in docs if terms & set(d["body"].split())]
            pool = rng.sample(containing, min(len(containing), rng.randrange(0, 25)))
            pool += rng.sample([d["id"] for d in docs], 3)
            for doc in sorted(set(pool)):
                j.write(f"{qid} 0 {doc} {rng.choice([0, 0, 0, 1, 1, 2, 3])}\n")

    import os

    for side in ("base", "head"):
        os.makedirs(f"{out}/{side}", exist_ok=True)
        rules = (
            "format: 1\nrevision: 1\npipeline:\n  stemmer: none\n  lowercase: true\n"
        )
        if side == "head":
            a, b, c, d = vocab[0], vocab[1], vocab[2], vocab[3]
            rules += (
                "synonyms:\n"
                f"  - equivalent: [{a}, {b}]\n"
                f"  - one_way:\n      from: {c}\n      to: [{d}]\n"
            )
        with open(f"{out}/{side}/rules.yaml", "w") as f:
            f.write(rules)


def judged_ids(qrels_path, judged_queries_path):
    judged = {q.query_id for q in ir_measures.read_trec_qrels(qrels_path)}
    with open(judged_queries_path) as f:
        with_text = {line.split("\t", 1)[0] for line in f if line.strip()}
    return sorted(judged & with_text)


def metrics(qrels_path, judged_queries_path, run_path, depth):
    depth = int(depth)
    names = {"P@10": P @ 10, "nDCG@10": nDCG @ 10, f"R@{depth}": R @ depth,
             f"AP@{depth}": AP @ depth, f"RR@{depth}": RR}
    qids = judged_ids(qrels_path, judged_queries_path)
    qrels = [q for q in ir_measures.read_trec_qrels(qrels_path) if q.query_id in qids]
    run = list(ir_measures.read_trec_run(run_path))
    provider = ir_measures.pytrec_eval
    per_query = {name: {qid: 0.0 for qid in qids} for name in names}
    by_measure = {str(m): name for name, m in names.items()}
    for m in provider.iter_calc(list(names.values()), qrels, run):
        per_query[by_measure[str(m.measure)]][m.query_id] = m.value
    means = {name: (sum(v.values()) / len(v) if v else 0.0) for name, v in per_query.items()}
    return {"queries": qids, "per_query": per_query, "means": means}


def scores(corpus_path, field, queries_path, judged_queries_path):
    from importlib.metadata import version

    import bm25s
    from sklearn.feature_extraction.text import CountVectorizer, TfidfTransformer

    docs = [json.loads(line) for line in open(corpus_path) if line.strip()]
    ids = [d["id"] for d in docs]
    tokens = [d.get(field, "").lower().split() for d in docs]
    texts = {}
    with open(judged_queries_path) as f:
        for line in f:
            if line.strip():
                qid, text = line.rstrip("\n").split("\t", 1)
                texts[qid] = text.lower().split()

    # bm25s's BM25L idf is ln((N + 1)/(df + 0.5)), which is ln(1 + (N - df + 0.5)/(df + 0.5))
    # written another way: the idf lexdelta uses.
    bm25 = bm25s.BM25(k1=1.2, b=0.75, method="atire", idf_method="bm25l", dtype="float64")
    bm25.index(tokens, show_progress=False)

    counts = CountVectorizer(analyzer=lambda d: d, lowercase=False)
    matrix = counts.fit_transform(tokens)
    df = np.bincount(matrix.indices, minlength=matrix.shape[1])
    tfidf = TfidfTransformer(sublinear_tf=True, norm="l2", smooth_idf=False)
    tfidf.fit(matrix)
    tfidf.idf_ = np.log(len(docs) / df)
    weights = tfidf.transform(matrix).tocsc()

    out = {"libraries": {"bm25s": version("bm25s"), "scikit-learn": version("scikit-learn")},
           "bm25": {}, "cosine": {}}
    for qid, terms in sorted(texts.items()):
        known = [t for t in terms if t in counts.vocabulary_]
        containing = set()
        for t in known:
            containing |= {ids[i] for i in weights[:, counts.vocabulary_[t]].indices}
        bm = bm25.get_scores(known) if known else np.zeros(len(docs))
        cos = np.zeros(len(docs))
        for t in known:
            cos += weights[:, counts.vocabulary_[t]].toarray().ravel()
        out["bm25"][qid] = {ids[i]: float(bm[i]) for i in range(len(docs)) if ids[i] in containing}
        out["cosine"][qid] = {ids[i]: float(cos[i]) for i in range(len(docs))
                              if ids[i] in containing}
    return out


def main():
    command, args = sys.argv[1], sys.argv[2:]
    if command == "generate":
        generate(args[0], int(args[1]))
    elif command == "metrics":
        json.dump(metrics(*args), sys.stdout)
    elif command == "scores":
        json.dump(scores(*args), sys.stdout)
    else:
        sys.exit(f"unknown command {command!r}")


if __name__ == "__main__":
    main()
