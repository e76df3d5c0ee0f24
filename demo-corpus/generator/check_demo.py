#!/usr/bin/env python3
"""Check the invariants of the demo data set (standard library only).

    python3 demo-corpus/generator/check_demo.py [--root DIR]

Exits non-zero and lists the problems if any invariant does not hold.
"""

import argparse
import collections
import csv
import datetime as dt
import json
import os
import re
import sys

HERE = os.path.dirname(os.path.abspath(__file__))


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--root", default=os.path.normpath(os.path.join(HERE, "..", "..")))
    args = ap.parse_args()
    base = os.path.join(args.root, "demo-corpus")
    problems = []

    def bad(msg):
        problems.append(msg)

    # documents
    docs = {}
    with open(os.path.join(base, "documents.jsonl"), encoding="utf-8") as f:
        for n, line in enumerate(f, 1):
            d = json.loads(line)
            if list(d) != ["id", "title", "body", "section", "updated"]:
                bad(f"documents.jsonl:{n}: fields {list(d)}")
            if not re.fullmatch(r"kb-\d{4}", d["id"]) or d["id"] in docs:
                bad(f"documents.jsonl:{n}: bad or repeated id {d['id']}")
            day = dt.date.fromisoformat(d["updated"])
            if not dt.date(2024, 1, 1) <= day <= dt.date(2026, 12, 31):
                bad(f"documents.jsonl:{n}: updated {d['updated']} outside 2024-2026")
            if not d["title"].strip() or not d["body"].strip():
                bad(f"documents.jsonl:{n}: empty title or body")
            docs[d["id"]] = d
    if len(docs) < 420:
        bad(f"only {len(docs)} documents")

    # queries
    queries = {}
    prev = None
    with open(os.path.join(base, "queries.jsonl"), encoding="utf-8") as f:
        for n, line in enumerate(f, 1):
            q = json.loads(line)
            if list(q) != ["query", "count", "clicks"]:
                bad(f"queries.jsonl:{n}: fields {list(q)}")
            if q["query"] != q["query"].lower() or q["query"] != q["query"].strip():
                bad(f"queries.jsonl:{n}: query not lowercase/trimmed: {q['query']!r}")
            if q["query"] in queries:
                bad(f"queries.jsonl:{n}: repeated query {q['query']!r}")
            if not isinstance(q["count"], int) or q["count"] < 1:
                bad(f"queries.jsonl:{n}: bad count")
            if sum(q["clicks"].values()) > q["count"]:
                bad(f"queries.jsonl:{n}: more clicks than searches")
            for doc_id, c in q["clicks"].items():
                if doc_id not in docs or c < 1:
                    bad(f"queries.jsonl:{n}: bad click {doc_id}: {c}")
            key = (-q["count"], q["query"])
            if prev is not None and key < prev:
                bad(f"queries.jsonl:{n}: not sorted by count desc, query asc")
            prev = key
            queries[q["query"]] = q
    if len(queries) < 3000:
        bad(f"only {len(queries)} distinct queries")

    # sessions
    seen = collections.Counter()
    n_sessions = 0
    with open(os.path.join(base, "sessions.jsonl"), encoding="utf-8") as f:
        for n, line in enumerate(f, 1):
            s = json.loads(line)
            n_sessions += 1
            if list(s) != ["session", "searches"] or s["session"] != f"s-{n:06d}":
                bad(f"sessions.jsonl:{n}: bad session record")
            if not s["searches"]:
                bad(f"sessions.jsonl:{n}: no searches")
            for se in s["searches"]:
                if list(se) != ["query", "clicks"]:
                    bad(f"sessions.jsonl:{n}: fields {list(se)}")
                if se["query"] not in queries:
                    bad(f"sessions.jsonl:{n}: query not in the log: {se['query']!r}")
                    continue
                seen[se["query"]] += 1
                for doc_id in se["clicks"]:
                    if doc_id not in docs:
                        bad(f"sessions.jsonl:{n}: unknown doc {doc_id}")
    for q, c in seen.items():
        if c > queries[q]["count"]:
            bad(f"sessions use {q!r} {c} times but the log has {queries[q]['count']}")
    if n_sessions < 1500:
        bad(f"only {n_sessions} sessions")

    # judgments, three ways
    tsv = {}
    with open(os.path.join(base, "judged-queries.tsv"), encoding="utf-8") as f:
        for line in f:
            qid, text = line.rstrip("\n").split("\t")
            tsv[qid] = text
            if text not in queries:
                bad(f"judged query not in queries.jsonl: {text!r}")
    qrels = []
    with open(os.path.join(base, "judgments.qrels"), encoding="utf-8") as f:
        for line in f:
            qid, zero, doc_id, rel = line.split()
            qrels.append((qid, doc_id, int(rel)))
            if zero != "0" or doc_id not in docs or int(rel) not in (0, 1, 2, 3):
                bad(f"bad qrels line: {line.strip()}")
    if qrels != sorted(qrels, key=lambda r: (r[0], r[1])):
        bad("judgments.qrels not sorted by QID then DOCID")
    with open(os.path.join(base, "judgments.csv"), encoding="utf-8", newline="") as f:
        rows = list(csv.reader(f))
    if rows[0] != ["query_id", "query", "doc_id", "relevance"]:
        bad("judgments.csv header")
    csv_rows = [(r[0], r[2], int(r[3])) for r in rows[1:]]
    if csv_rows != qrels:
        bad("judgments.csv and judgments.qrels differ")
    for r in rows[1:]:
        if tsv.get(r[0]) != r[1]:
            bad(f"judgments.csv query text differs from judged-queries.tsv for {r[0]}")
    per_q = collections.defaultdict(list)
    for qid, _, rel in qrels:
        per_q[qid].append(rel)
    if set(per_q) != set(tsv):
        bad("qrels and judged-queries.tsv name different queries")
    for qid, rels in per_q.items():
        if len(rels) < 8:
            bad(f"{qid}: only {len(rels)} judged documents")
        if not (0 in rels and max(rels) >= 2):
            bad(f"{qid}: grades {sorted(set(rels))} lack a mix")
    if len(tsv) < 90:
        bad(f"only {len(tsv)} judged queries")

    # rulesets: the proposed one is a complete copy with bumped revisions
    live_dir = os.path.join(args.root, "rules")
    prop_dir = os.path.join(base, "proposed")

    def revision(path):
        with open(path, encoding="utf-8") as f:
            m = re.search(r"^revision: (\d+)$", f.read(), re.M)
        return int(m.group(1)) if m else None

    for name in sorted(os.listdir(live_dir)):
        lp, pp = os.path.join(live_dir, name), os.path.join(prop_dir, name)
        if not os.path.exists(pp):
            bad(f"proposed/ lacks {name}")
            continue
        with open(lp, encoding="utf-8") as a, open(pp, encoding="utf-8") as b:
            same = a.read() == b.read()
        if not same and revision(pp) != revision(lp) + 1:
            bad(f"proposed/{name} changed but its revision was not bumped")
    for name in sorted(os.listdir(prop_dir)):
        if not os.path.exists(os.path.join(live_dir, name)) and revision(os.path.join(prop_dir, name)) != 1:
            bad(f"new file proposed/{name} should start at revision 1")

    if problems:
        print("\n".join(problems))
        print(f"{len(problems)} problem(s)")
        sys.exit(1)
    print(f"ok: {len(docs)} documents, {len(queries)} queries, {n_sessions} sessions, "
          f"{len(tsv)} judged queries, {len(qrels)} qrels lines")


if __name__ == "__main__":
    main()
