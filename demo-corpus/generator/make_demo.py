#!/usr/bin/env python3
"""Build the lexdelta demo data set: the help centre of Corrin Sound Transit.

    python3 demo-corpus/generator/make_demo.py [--root DIR] [--verb-exc FILE]

Writes demo-corpus/{documents,queries,sessions}.jsonl, the judgments (qrels,
TSV, CSV), demo-corpus/README.md, the live ruleset in rules/ and the proposed
change in demo-corpus/proposed/.  Standard library only; a fixed seed, so two
runs give byte-identical files.  The WordNet import needs verb.exc from the
Debian package wordnet-base (apt-get install wordnet-base); without it an
existing proposed/irregular-verbs.yaml is left as it is.
"""

import sys

sys.dont_write_bytecode = True

import argparse
import collections
import csv
import datetime as dt
import io
import json
import math
import os
import random
import re

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)

import articles_a  # noqa: E402
import articles_b  # noqa: E402
import articles_c  # noqa: E402
import articles_d  # noqa: E402
import articles_e  # noqa: E402
import notices  # noqa: E402
import queries_spec  # noqa: E402
import rulesets  # noqa: E402

SEED = 20250611
WORD = re.compile(r"[a-z0-9]+(?:'[a-z]+)?")
STOPWORDS = {"a", "an", "and", "the", "of", "to", "for", "on", "in", "at", "my", "is",
             "i", "do", "how", "can", "what", "with"}


def words(text):
    return WORD.findall(text.lower())


# ---------------------------------------------------------------- documents
def build_documents(rng):
    docs = []
    for section, title, tags, body in (articles_a.ARTICLES_A + articles_b.ARTICLES_B
                                       + articles_c.ARTICLES_C + articles_d.ARTICLES_D
                                       + articles_e.ARTICLES_E):
        docs.append(dict(section=section, title=title, tags=tags.split(),
                         body=body.strip(), updated=notices.rand_date(rng), hand=True))
    gen = []
    routes = list(notices.BUS_ROUTES)
    for r in routes:
        gen.append(notices.timetable_notice(rng, r))
    for r in rng.sample(routes, 8):
        gen.append(notices.timetable_notice(rng, r))
    for r in routes:
        gen.append(notices.diversion_notice(rng, r))
    for r in rng.sample(routes, 14):
        gen.append(notices.diversion_notice(rng, r))
    for _ in range(9):
        gen.append(notices.tram_works_notice(rng))
    for k in range(18):
        gen.append(notices.stop_notice(rng, k))
    for k in range(len(notices.EVENTS)):
        gen.append(notices.event_notice(rng, k))
    for k in range(4):
        gen.append(notices.event_notice(rng, rng.randrange(len(notices.EVENTS))))
    for year, month in [(2024, m) for m in range(6, 13)] + [(2025, m) for m in range(1, 13)] + [(2026, m) for m in range(1, 5)]:
        gen.append(notices.performance_report(rng, year, month))
    for r in notices.EXPRESS_ROUTES:
        gen.append(notices.express_page(rng, r))
    for r in notices.NIGHT_ROUTES:
        gen.append(notices.night_page(rng, r))
    for k in range(9):
        gen.append(notices.ferry_notice(rng, k))
    for g in gen:
        g["tags"] = g["tags"].split()
    docs.extend(gen)

    # Titles must be unique, as in a real help centre: add the date to
    # notices that happen to share one.
    seen = collections.Counter()
    for d in docs:
        seen[d["title"]] += 1
    dup = {t for t, n in seen.items() if n > 1}
    for d in docs:
        if d["title"] in dup:
            d["title"] = f'{d["title"]} ({notices.fmt_date(d["updated"])})'
    clamp_lo, clamp_hi = dt.date(2024, 1, 2), dt.date(2026, 6, 28)
    for d in docs:
        d["updated"] = min(max(d["updated"], clamp_lo), clamp_hi)

    rng.shuffle(docs)
    for i, d in enumerate(docs, 1):
        d["id"] = f"kb-{i:04d}"
        d["words"] = set(words(d["title"] + " " + d["body"]))
        d["text"] = (d["title"] + "\n" + d["body"]).lower()
        size = len(d["body"])
        d["pop"] = rng.random() * 0.5 + (0.5 if size > 700 else 0.3 if size > 300 else 0.0)
    return docs


# ---------------------------------------------------------------- grading
def tag_match(pattern, tags):
    """0 = no match, 1 = secondary match, 2 = primary (or combination) match."""
    if "+" in pattern:
        return 2 if all(p in tags for p in pattern.split("+")) else 0
    if pattern.endswith("*"):
        return 1 if any(t.startswith(pattern[:-1]) for t in tags) else 0
    if tags[0] == pattern:
        return 2
    return 1 if pattern in tags else 0


def grade(intent, doc):
    if intent.startswith("route-tt:") or intent.startswith("route-dv:"):
        kind, r = intent.split(":", 1)
        rt = f"route:{r}"
        main = "timetable-route" if kind == "route-tt" else "diversion"
        if rt in doc["tags"] and doc["tags"][0] == main:
            return 3
        if rt in doc["tags"]:
            return 2
        if doc["tags"][0] in ("timetable-general", "diversion-general"):
            return 1
        return 0
    if intent.startswith("express:") or intent.startswith("night:"):
        kind, r = intent.split(":", 1)
        rt = f"route:{r}"
        main = "express-route" if kind == "express" else "night-bus"
        if rt in doc["tags"] and doc["tags"][0] == main:
            return 3
        if rt in doc["tags"]:
            return 2
        if doc["tags"][0] == main:
            return 1
        return 0
    if intent.startswith("stop:"):
        name = intent[5:].lower()
        if name in doc["title"].lower():
            return 2
        if name in doc["body"].lower():
            return 1
        return 0
    g3, g2, g1 = queries_spec.INTENTS[intent]
    best = 0
    for p in g3:
        m = tag_match(p, doc["tags"])
        best = max(best, 3 if m == 2 else 2 if m == 1 else 0)
    for p in g2:
        m = tag_match(p, doc["tags"])
        best = max(best, 2 if m == 2 else 1 if m == 1 else 0)
    for p in g1:
        if tag_match(p, doc["tags"]):
            best = max(best, 1)
    return best


# ---------------------------------------------------------------- live retrieval (rough)
class LiveMatcher:
    """A rough stand-in for today's search, used only to decide which
    articles riders could have seen and clicked: a query word matches an
    article word when they are equal, differ by a plural ending, or share a
    long prefix (about what the stemmer does); live synonyms apply."""

    def __init__(self, docs, synonym_text):
        self.docs = docs
        vocab = set()
        for d in docs:
            vocab |= d["words"]
        self.vocab = sorted(vocab)
        self.cache = {}
        self.expand = collections.defaultdict(set)
        for kind, members in rulesets.parse_synonyms(synonym_text):
            if kind == "eq":
                for m in members:
                    self.expand[m] |= set(members)
            else:
                frm, to = members
                self.expand[frm] |= set(to) | {frm}

    def similar(self, t):
        if t in self.cache:
            return self.cache[t]
        out = set()
        for w in self.vocab:
            if w == t or w == t + "s" or t == w + "s" or w == t + "es" or t == w + "es":
                out.add(w)
                continue
            n = 0
            for a, b in zip(w, t):
                if a != b:
                    break
                n += 1
            if n >= 5 and n >= min(len(w), len(t)) - 3:
                out.add(w)
        self.cache[t] = out
        return out

    def query_terms(self, q):
        """List of alternatives per query position: each a set of word tuples."""
        toks = [t for t in words(q)]
        groups = []
        i = 0
        used = set()
        # phrases from synonyms first
        for phrase, alts in self.expand.items():
            pw = words(phrase)
            for j in range(len(toks) - len(pw) + 1):
                if toks[j:j + len(pw)] == pw and not used & set(range(j, j + len(pw))):
                    used |= set(range(j, j + len(pw)))
                    groups.append({tuple(w for w in words(a) if w not in STOPWORDS) for a in alts})
        for j, t in enumerate(toks):
            if j in used or t in STOPWORDS:
                continue
            groups.append({(t,)})
            i += 1
        return groups

    def match(self, q, doc):
        """Number of query positions that the article matches."""
        n = 0
        for alts in self.query_terms(q):
            ok = False
            for alt in alts:
                if alt and all(self.similar(w) & doc["words"] for w in alt):
                    ok = True
                    break
            n += ok
        return n


# ---------------------------------------------------------------- queries
KEYBOARD = {
    "a": "sqwz", "b": "vghn", "c": "xdfv", "d": "serfcx", "e": "wsdr", "f": "drtgvc",
    "g": "ftyhbv", "h": "gyujnb", "i": "ujko", "j": "huikmn", "k": "jiolm", "l": "kop",
    "m": "njk", "n": "bhjm", "o": "iklp", "p": "ol", "q": "wa", "r": "edft", "s": "awedxz",
    "t": "rfgy", "u": "yhji", "v": "cfgb", "w": "qase", "x": "zsdc", "y": "tghu", "z": "asx",
}


def make_typo(rng, q):
    ws = q.split(" ")
    cand = [i for i, w in enumerate(ws) if len(w) >= 4 and w.isalpha()]
    if not cand:
        return None
    i = rng.choice(cand)
    w = ws[i]
    kind = rng.choice(["drop", "swap", "double", "near", "near", "drop"])
    p = rng.randrange(1, len(w) - 1)
    if kind == "drop":
        w2 = w[:p] + w[p + 1:]
    elif kind == "swap":
        w2 = w[:p] + w[p + 1] + w[p] + w[p + 2:]
    elif kind == "double":
        w2 = w[:p] + w[p] + w[p:]
    else:
        c = w[p]
        w2 = w[:p] + rng.choice(KEYBOARD.get(c, c)) + w[p + 1:]
    if w2 == w:
        return None
    ws[i] = w2
    return " ".join(ws)


QUESTIONS = {
    "student-pass": ["how to get a student pass", "how do i apply for a student pass", "student pass how to apply", "where do i get a student pass", "student pass age limit", "student pass cost", "student pass price", "how much is a student pass"],
    "senior-pass": ["how to get a senior pass", "apply for senior pass", "senior pass age", "senior pass times", "free travel over 66", "when can i use my senior pass"],
    "university-pass": ["how to get a university pass", "university pass how to apply", "university pass cost", "university pass for staff", "is the university pass valid on the ferry", "university pass term dates", "university pass apply"],
    "university-renew": ["renew university pass", "university pass next year"],
    "concession": ["who can get a concession fare", "concession fare eligibility", "concession fares", "half price bus fare"],
    "season": ["season ticket price", "monthly season ticket", "how much is a season ticket", "season ticket refund"],
    "card": ["how do i get a wayfare card", "where to buy wayfare card", "wayfare card price", "what is a wayfare card", "smart card price", "travel card buy"],
    "topup": ["how do i top up my card", "top up wayfare card online", "top up card", "where can i top up", "top up at shop"],
    "balance": ["how do i check my balance", "wayfare balance", "check card balance online"],
    "card-lost": ["i lost my wayfare card", "lost my card", "stolen wayfare card", "lost travel card", "replace lost card"],
    "lost-property": ["how to report lost property", "lost property form", "lost something on bus", "lost something on tram", "report lost item", "lost property contact", "lost property number", "how long is lost property kept", "lost property halvering"],
    "lost-phone": ["lost my phone on the tram", "lost phone on ferry", "left my phone on the bus"],
    "left-luggage": ["where can i store luggage", "left luggage opening times", "left luggage cost", "luggage storage price", "store bags halvering central", "left luggage near ferry"],
    "refund": ["how do i get a refund", "refund ticket app", "how to get refund", "can i get a refund", "refund request"],
    "compensation": ["how to claim delay compensation", "claim compensation late bus", "delay compensation form", "tram late compensation"],
    "timetable": ["bus timetables", "timetables", "printed timetable", "timetable pdf"],
    "tram-times": ["when is the next tram", "tram times halvering central", "first tram time", "tram every how many minutes"],
    "ferry-timetable": ["ferry times today", "first ferry", "last ferry", "ferry timetable sunday", "ferry every 20 minutes", "ferrisham ferry times", "harbour quay ferry"],
    "night-bus": ["night bus times", "night bus routes", "night buses friday", "is there a night bus", "night bus to morrow green"],
    "park-and-ride": ["park and ride cost", "park and ride opening times", "park and ride sunday", "where is park and ride", "park and ride parking free"],
    "bike-bus": ["can i take my bike on the bus", "bikes on buses", "bike on express bus", "taking a bike on the bus"],
    "bike-tram": ["can i take my bike on the tram", "bike tram peak times", "bikes allowed on trams"],
    "bike-ferry": ["bike on the ferry", "can i take my bike on the ferry", "ferry bikes"],
    "pram-bus": ["can i take a pram on the bus", "pram bus rules", "pushchair bus fold"],
    "pram-tram": ["pram on the tram", "pushchair tram"],
    "pram-ferry": ["pram on ferry", "pushchair ferry"],
    "wheelchair": ["wheelchair bus", "wheelchair access bus", "wheelchair users", "can i travel in a wheelchair"],
    "step-free": ["step free tram stops", "which stops are step free", "step free map", "stations with lifts"],
    "lift": ["lift not working", "lift broken", "lift status"],
    "accessibility": ["disabled access", "accessible transport", "accessibility guide", "access for disabled"],
    "access-pass": ["free bus pass disabled", "disabled bus pass", "apply for access pass", "disability pass"],
    "transfer": ["how do i change between bus and tram", "change bus to tram", "transfer between bus and tram", "connection bus ferry", "change at stonesend", "changing trams"],
    "change-booking": ["how to change a booking", "change group booking", "amend my booking", "change assistance booking"],
    "amend-details": ["change my address", "update my details", "change email address", "change phone number"],
    "direct-debit": ["direct debit date", "change direct debit", "cancel direct debit"],
    "general-enquiries": ["contact number", "customer service number", "how to contact corrin sound transit", "contact email"],
    "complaint": ["how to complain", "complain about driver", "complaint form"],
    "express": ["express bus times", "express buses", "fast bus to city", "limited stop bus"],
    "airport": ["how to get to the airport", "airport bus times", "x40 times", "bus to the airport from halvering"],
    "contactless": ["pay contactless", "contactless bus", "tap on tap off", "contactless tram", "pay by phone"],
    "penalty": ["penalty fare appeal", "i got a penalty fare", "how much is a penalty fare"],
    "fares": ["how much is a bus ticket", "how much is the tram", "single fare", "bus fare price", "ticket price"],
    "child": ["do kids travel free", "child fares", "under 5 travel free", "how old for child fare"],
    "diversions": ["current diversions", "road closure buses", "bus diversion today"],
    "rail-replacement": ["tram replacement bus", "replacement buses", "no trams this weekend"],
    "delay": ["why is my bus late", "bus running late", "trams delayed"],
    "escooter": ["are e-scooters allowed", "e-scooter on bus", "scooter ban"],
    "jobs": ["job vacancies", "work for corrin sound transit", "become a bus driver"],
    "app": ["download app", "journey app", "corrin journeys"],
    "account": ["reset password", "cant log in", "create account"],
    "zones": ["zone map", "which zone am i in", "fare zone map"],
    "zone-transition": ["new fare zones", "old zones", "zone changes"],
    "holiday": ["bank holiday timetable", "christmas buses", "new year buses", "easter timetable"],
    "tram-lines": ["tram route map", "campus line tram", "harbour line times"],
    "dog": ["dogs on trams", "can i bring my dog", "dog on the tram"],
    "toilets": ["toilets at stations", "accessible toilets", "changing places toilet"],
    "luggage": ["luggage on bus", "suitcase on tram", "big suitcase on bus"],
    "police": ["report antisocial behaviour", "safety officer", "feel unsafe on bus"],
    "realtime": ["next bus", "live bus times", "bus tracker", "real time bus"],
    "journey-planner": ["plan a journey", "route planner", "journey planner app"],
    "events": ["festival buses", "event buses", "match day buses"],
}

MODIFIERS = ["price", "cost", "online", "app", "halvering", "2025", "2026", "help", "info", "near me"]
MODIFIER_BASES = [("student pass", "student-pass"), ("senior pass", "senior-pass"),
                  ("university pass", "university-pass"), ("season ticket", "season"),
                  ("wayfare card", "card"), ("park and ride", "park-and-ride"),
                  ("left luggage", "left-luggage"), ("lost property", "lost-property"),
                  ("night bus", "night-bus"), ("ferry", "ferry-timetable"),
                  ("concession fare", "concession"), ("day ticket", "fares"),
                  ("refund", "refund"), ("timetable", "timetable"), ("tram", "tram"),
                  ("bus pass", "pass-overview"), ("access pass", "access-pass"),
                  ("delay compensation", "compensation"), ("smart card", "card"),
                  ("child fare", "child"), ("group ticket", "group")]


def build_queries(rng, docs, matcher):
    hand = queries_spec.hand_queries()
    by_q = {}
    for h in hand:
        assert h["query"] not in by_q, h["query"]
        by_q[h["query"]] = dict(h, source=None, kind="hand")

    generated = []  # (query, intent, weight)

    def add(q, intent, weight):
        q = " ".join(q.lower().split())
        if q and q not in by_q and all(q != g[0] for g in generated):
            generated.append((q, intent, weight))

    routes = list(notices.BUS_ROUTES)
    route_pop = {r: 1.0 / (i + 1) ** 0.6 for i, r in enumerate(rng.sample(routes, len(routes)))}
    tt_patterns = [("{r} timetable", 1.0), ("bus {r} timetable", 0.8), ("route {r}", 0.7),
                   ("{r} bus times", 0.7), ("{r} bus", 0.6), ("number {r} bus", 0.3),
                   ("{r} timetable sunday", 0.3), ("{r} times", 0.5), ("bus {r}", 0.5),
                   ("{r} bus route", 0.3), ("{r} bus stops", 0.2), ("{r} last bus", 0.25),
                   ("{r} first bus", 0.15), ("route {r} timetable", 0.4),
                   ("{r} bus timetable", 0.5), ("{r} saturday", 0.12), ("{r} sunday times", 0.12)]
    dv_patterns = [("route {r} diversion", 0.35), ("{r} diversion", 0.4), ("{r} bus diverted", 0.15),
                   ("{r} roadworks", 0.1)]
    for r in routes:
        for pat, w in tt_patterns:
            add(pat.format(r=r), f"route-tt:{r}", w * route_pop[r])
        for pat, w in dv_patterns:
            add(pat.format(r=r), f"route-dv:{r}", w * route_pop[r])
    for r in notices.EXPRESS_ROUTES:
        rl = r.lower()
        for pat, w in [("{r}", 0.8), ("{r} bus", 0.6), ("{r} times", 0.5), ("{r} express", 0.4),
                       ("{r} timetable", 0.6), ("{r} route", 0.3), ("{r} bus times", 0.3)]:
            add(pat.format(r=rl), f"express:{rl}", w * 0.8)
    for r in notices.NIGHT_ROUTES:
        rl = r.lower()
        for pat, w in [("{r}", 0.6), ("{r} bus", 0.5), ("{r} times", 0.4), ("{r} night bus", 0.5),
                       ("{r} timetable", 0.4)]:
            add(pat.format(r=rl), f"night:{rl}", w * 0.6)
    stops = notices.STOPS + ["Halvering Central", "Ferrisham Pier"]
    for i, s in enumerate(stops):
        sl = s.lower().replace("'", "")
        w = 0.6 / (1 + i * 0.08)
        for pat, pw in [("{s}", 1.0), ("{s} tram stop", 0.4), ("{s} bus stop", 0.4),
                        ("buses from {s}", 0.25), ("trams to {s}", 0.2), ("{s} stop", 0.3),
                        ("bus to {s}", 0.35), ("how do i get to {s}", 0.15),
                        ("{s} parking", 0.08)]:
            add(pat.format(s=sl), f"stop:{s}", w * pw)
    pairs = [(a, b) for a in stops for b in stops if a != b]
    for a, b in rng.sample(pairs, 430):
        add(f"{a.lower()} to {b.lower()}".replace("'", ""), "journey-planner", rng.uniform(0.02, 0.25))
    for intent, qs in QUESTIONS.items():
        for q in qs:
            add(q, intent, rng.uniform(0.1, 0.7))
    for base, intent in MODIFIER_BASES:
        for m in MODIFIERS:
            if rng.random() < 0.75:
                add(f"{base} {m}", intent, rng.uniform(0.03, 0.35))

    # Zipf-like traffic for everything generated, by weight rank.
    generated.sort(key=lambda g: (-g[2] * rng.uniform(0.6, 1.4), g[0]))
    for rank, (q, intent, w) in enumerate(generated):
        val = 1500.0 / (rank + 12) ** 0.97
        count = max(1, int(round(val * rng.uniform(0.7, 1.3))))
        by_q[q] = dict(query=q, count=count, intent=intent, judged=False, decoys=[],
                       source=None, kind="gen")

    # Typos of the busier queries.
    base_list = sorted(by_q.values(), key=lambda r: (-r["count"], r["query"]))
    for row in base_list:
        if row["count"] < 15 or row["kind"] == "typo":
            continue
        n_typos = 1 + (row["count"] >= 150) + (row["count"] >= 600) + (row["count"] >= 2000) + (row["count"] >= 5000)
        for _ in range(n_typos):
            t = make_typo(rng, row["query"])
            if not t or t in by_q:
                continue
            c = max(1, int(round(row["count"] * rng.uniform(0.002, 0.03))))
            by_q[t] = dict(query=t, count=c, intent=row["intent"], judged=False, decoys=[],
                           source=row["query"], kind="typo")

    rows = sorted(by_q.values(), key=lambda r: (-r["count"], r["query"]))

    # Clicks: riders click what today's search showed them, mostly the
    # articles that answer the question.
    for row in rows:
        row["clicks"] = {}
        cands = []
        for d in docs:
            g = grade(row["intent"], d)
            if g < 2 and not (g == 1 and row["intent"].startswith("stop:")):
                continue
            m = matcher.match(row["query"], d)
            if m == 0:
                continue
            cands.append((-(g + 0.6 * m), -d["pop"], d["id"]))
        if not cands:
            continue
        cands.sort()
        top = [c[2] for c in cands[:rng.randint(2, 6)]]
        ctr = rng.uniform(0.3, 0.7)
        if row["kind"] == "typo":
            ctr *= 0.5
        total = int(row["count"] * ctr + rng.random())
        shares = [1.0, 0.45, 0.25, 0.15, 0.1, 0.06][:len(top)]
        ssum = sum(shares)
        clicks = {}
        left = total
        for doc_id, s in zip(top, shares):
            c = min(left, int(round(total * s / ssum)))
            if c > 0:
                clicks[doc_id] = c
                left -= c
        row["clicks"] = dict(sorted(clicks.items(), key=lambda kv: (-kv[1], kv[0])))
    return rows


# ---------------------------------------------------------------- sessions
def build_sessions(rng, rows, n_sessions=1900):
    by_q = {r["query"]: r for r in rows}
    budget = {r["query"]: r["count"] for r in rows}
    click_budget = {r["query"]: dict(r["clicks"]) for r in rows}
    by_intent = collections.defaultdict(list)
    for r in rows:
        by_intent[r["intent"]].append(r["query"])

    def take(q, mode=None):
        if budget.get(q, 0) <= 0:
            return None
        budget[q] -= 1
        cb = click_budget[q]
        total_clicks = sum(cb.values())
        clicked = []
        # chance of a click is the remaining click-through of this query
        chance = min(0.95, total_clicks / max(1, budget[q] + 1))
        if mode == "reformulated":
            chance *= 0.25
        elif mode == "final":
            chance = max(chance, 0.8)
        if total_clicks and rng.random() < chance:
            ids = sorted(cb)
            weights = [cb[i] for i in ids]
            first = rng.choices(ids, weights)[0]
            clicked.append(first)
            cb[first] -= 1
            if cb[first] == 0:
                del cb[first]
            if cb and rng.random() < 0.15:
                ids = sorted(cb)
                second = rng.choices(ids, [cb[i] for i in ids])[0]
                if second != first:
                    clicked.append(second)
                    cb[second] -= 1
                    if cb[second] == 0:
                        del cb[second]
        return {"query": q, "clicks": clicked}

    chains = queries_spec.CHAINS
    for _, chain in chains:
        for q in chain:
            assert q in by_q, f"chain query missing from the log: {q}"
    weights = [w for w, _ in chains]
    sessions = []
    head = [r["query"] for r in rows]
    head_w = [r["count"] for r in rows]
    typos = [r for r in rows if r["kind"] == "typo"]
    attempts = 0
    while len(sessions) < n_sessions and attempts < n_sessions * 20:
        attempts += 1
        roll = rng.random()
        searches = []
        if roll < 0.32:
            chain = rng.choices(chains, weights)[0][1]
            for k, q in enumerate(chain):
                s = take(q, "final" if k == len(chain) - 1 else "reformulated")
                if s is None:
                    break
                searches.append(s)
            if len(searches) < len(chain):
                # give back what we took, try another session
                for s in searches:
                    budget[s["query"]] += 1
                searches = []
                continue
        elif roll < 0.40 and typos:
            t = rng.choice(typos)
            s1 = take(t["query"], "reformulated")
            s2 = take(t["source"], "final") if s1 else None
            if not (s1 and s2):
                if s1:
                    budget[t["query"]] += 1
                continue
            searches = [s1, s2]
        else:
            q = rng.choices(head, head_w)[0]
            s = take(q)
            if s is None:
                continue
            searches.append(s)
            n_more = rng.choices([0, 1, 2, 3], [55, 28, 12, 5])[0]
            for _ in range(n_more):
                pool = [x for x in by_intent[by_q[q]["intent"]] if x != q and budget[x] > 0]
                if not pool or rng.random() < 0.15:
                    pool = [x for x in head[:400] if budget[x] > 0]
                nq = rng.choice(sorted(pool))
                s = take(nq)
                if s:
                    searches.append(s)
                    q = nq
        sessions.append(searches)
    return [{"session": f"s-{i:06d}", "searches": s} for i, s in enumerate(sessions, 1)]


# ---------------------------------------------------------------- judgments
def decoy_hit(word, doc):
    w = re.escape(word.lower())
    return re.search(r"\b" + w + r"\w*", doc["text"]) is not None


def build_judgments(rng, rows, docs, matcher):
    """Graded judgments for the judged queries, pooled the TREC way: the top
    articles of two rough keyword runs (query words with today's synonyms;
    query words plus the look-alike words listed for the query) together
    with the best answers, all graded from the article topics."""
    n_docs = len(docs)
    tf = {d["id"]: collections.Counter(words(d["title"] + " " + d["title"] + " " + d["body"])) for d in docs}
    avg = sum(sum(c.values()) for c in tf.values()) / n_docs

    def run(terms, k):
        idf = {}
        for t in terms:
            sim = matcher.similar(t)
            df = sum(1 for d in docs if sim & d["words"])
            idf[t] = (sim, math.log(1 + (n_docs - df + 0.5) / (df + 0.5)))
        scored = []
        for d in docs:
            c = tf[d["id"]]
            dl = sum(c.values())
            s = 0.0
            for t, (sim, w) in idf.items():
                f = sum(c[x] for x in sim)
                if f:
                    s += w * f * 2.2 / (f + 1.2 * (0.25 + 0.75 * dl / avg))
            if s > 0:
                scored.append((-s, d["id"]))
        scored.sort()
        return [doc_id for _, doc_id in scored[:k]]

    by_id = {d["id"]: d for d in docs}
    judged = [r for r in rows if r["judged"]]
    judged.sort(key=lambda r: (-r["count"], r["query"]))
    out = []
    for qi, row in enumerate(judged, 1):
        qid = f"q{qi:03d}"
        qterms = []
        for alts in matcher.query_terms(row["query"]):
            for alt in sorted(alts):
                for w in alt:
                    if w not in qterms:
                        qterms.append(w)
        dterms = list(qterms)
        for dw in row["decoys"]:
            for w in words(dw):
                if w not in dterms and w not in STOPWORDS:
                    dterms.append(w)
        pool = {}
        for doc_id in run(qterms, 18) + (run(dterms, 30) if row["decoys"] else []):
            pool[doc_id] = grade(row["intent"], by_id[doc_id])
        ranked = run(qterms, n_docs)
        pos = {doc_id: i for i, doc_id in enumerate(ranked)}
        rel = sorted(((grade(row["intent"], d), d["id"]) for d in docs),
                     key=lambda gd: (-gd[0], pos.get(gd[1], n_docs), gd[1]))
        caps = {3: 10, 2: 5, 1: 3}
        taken = collections.Counter(g for g in pool.values())
        for g, doc_id in rel:
            if g > 0 and doc_id not in pool and taken[g] < caps[g]:
                pool[doc_id] = g
                taken[g] += 1
        # at least three non-relevant articles: more of the keyword run, then
        # (for queries that hardly share a word with any article) articles
        # from the sections that answer the query
        secs = {by_id[doc_id]["section"] for g, doc_id in rel[:3]}
        same_section = [d["id"] for d in sorted(docs, key=lambda d: (-d["pop"], d["id"]))
                        if d["section"] in secs]
        for doc_id in ranked + same_section:
            n_zero = sum(1 for g in pool.values() if g == 0)
            if n_zero >= 3 and len(pool) >= 8:
                break
            if doc_id not in pool and grade(row["intent"], by_id[doc_id]) == 0:
                pool[doc_id] = 0
        assert len(pool) >= 8, (row["query"], len(pool))
        for doc_id in sorted(pool):
            out.append((qid, row["query"], doc_id, pool[doc_id]))
    return judged, out


# ---------------------------------------------------------------- rules
def irregular_verbs(path, live_forms):
    lines_out = []
    with open(path, encoding="utf-8") as f:
        for line in f:
            parts = line.split()
            if len(parts) != 2:
                continue
            form, base = parts
            if not (re.fullmatch(r"[a-z]+", form) and re.fullmatch(r"[a-z]+", base)):
                continue
            if form == base or form in live_forms:
                continue
            lines_out.append(f"  - {{form: {form}, lemma: {base}}}\n")
    return rulesets.IRREGULAR_HEAD + "".join(lines_out), len(lines_out)


def write(path, text):
    os.makedirs(os.path.dirname(path), exist_ok=True)
    with open(path, "w", encoding="utf-8", newline="\n") as f:
        f.write(text)


def write_rules(root, verb_exc):
    live = os.path.join(root, "rules")
    prop = os.path.join(root, "demo-corpus", "proposed")
    write(os.path.join(live, "pipeline.yaml"), rulesets.PIPELINE)
    write(os.path.join(live, "synonyms.yaml"), rulesets.synonyms_live())
    write(os.path.join(live, "exempt.yaml"), rulesets.exempt_live())
    write(os.path.join(live, "lemmas.yaml"), rulesets.LEMMAS)
    write(os.path.join(prop, "pipeline.yaml"), rulesets.PIPELINE)
    write(os.path.join(prop, "synonyms.yaml"), rulesets.synonyms_proposed())
    write(os.path.join(prop, "exempt.yaml"), rulesets.exempt_proposed())
    write(os.path.join(prop, "lemmas.yaml"), rulesets.LEMMAS)
    live_forms = set(re.findall(r"^\s+form: (\S+)$", rulesets.LEMMAS, flags=re.M))
    target = os.path.join(prop, "irregular-verbs.yaml")
    if os.path.exists(verb_exc):
        text, n = irregular_verbs(verb_exc, live_forms)
        write(target, text)
    elif os.path.exists(target):
        print(f"note: {verb_exc} not found; keeping the existing {target}", file=sys.stderr)
        with open(target, encoding="utf-8") as f:
            n = sum(1 for line in f if line.startswith("  - {form:"))
    else:
        sys.exit(f"error: {verb_exc} not found (apt-get install wordnet-base) and no "
                 f"existing {target} to keep")
    return n


# ---------------------------------------------------------------- main
def main():
    ap = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    ap.add_argument("--root", default=os.path.normpath(os.path.join(HERE, "..", "..")),
                    help="repository root (default: two levels above this script)")
    ap.add_argument("--verb-exc", default="/usr/share/wordnet/verb.exc",
                    help="WordNet verb exception list (default: %(default)s)")
    args = ap.parse_args()
    root = args.root
    out = os.path.join(root, "demo-corpus")

    rng = random.Random(SEED)
    docs = build_documents(rng)
    matcher = LiveMatcher(docs, rulesets.synonyms_live())
    rows = build_queries(rng, docs, matcher)
    sessions = build_sessions(rng, rows)
    judged, qrels = build_judgments(rng, rows, docs, matcher)
    n_irregular = write_rules(root, args.verb_exc)

    buf = io.StringIO()
    for d in sorted(docs, key=lambda d: d["id"]):
        buf.write(json.dumps({"id": d["id"], "title": d["title"], "body": d["body"],
                              "section": d["section"], "updated": d["updated"].isoformat()},
                             ensure_ascii=False) + "\n")
    write(os.path.join(out, "documents.jsonl"), buf.getvalue())

    buf = io.StringIO()
    for r in rows:
        buf.write(json.dumps({"query": r["query"], "count": r["count"], "clicks": r["clicks"]},
                             ensure_ascii=False) + "\n")
    write(os.path.join(out, "queries.jsonl"), buf.getvalue())

    buf = io.StringIO()
    for s in sessions:
        buf.write(json.dumps(s, ensure_ascii=False) + "\n")
    write(os.path.join(out, "sessions.jsonl"), buf.getvalue())

    qid_of = {}
    for qid, q, _, _ in qrels:
        qid_of[q] = qid
    write(os.path.join(out, "judgments.qrels"),
          "".join(f"{qid} 0 {doc} {g}\n" for qid, _, doc, g in qrels))
    write(os.path.join(out, "judged-queries.tsv"),
          "".join(f"{qid_of[r['query']]}\t{r['query']}\n" for r in judged))
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(["query_id", "query", "doc_id", "relevance"])
    for row in qrels:
        w.writerow(row)
    write(os.path.join(out, "judgments.csv"), buf.getvalue())

    stats = dict(
        documents=len(docs), queries=len(rows), searches=sum(r["count"] for r in rows),
        clicks=sum(sum(r["clicks"].values()) for r in rows),
        sessions=len(sessions), session_searches=sum(len(s["searches"]) for s in sessions),
        judged=len(judged), qrels=len(qrels), irregular=n_irregular,
        sections=len({d["section"] for d in docs}),
        ones=sum(1 for r in rows if r["count"] == 1),
        live_synonyms=len(rulesets.parse_synonyms(rulesets.synonyms_live())),
        hand=sum(1 for d in docs if d.get("hand")),
        pool_min=min(collections.Counter(q for q, _, _, _ in qrels).values()),
        pool_max=max(collections.Counter(q for q, _, _, _ in qrels).values()),
    )
    import readme  # noqa: E402
    write(os.path.join(out, "README.md"), readme.render(stats))
    print(json.dumps(stats))


if __name__ == "__main__":
    main()
