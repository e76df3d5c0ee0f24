"""demo-corpus/README.md, with the counts of the current build."""

TEMPLATE = """\
# Demo data set: Corrin Sound Transit help centre

A complete, invented data set for trying lexdelta end to end: a help centre,
the searches riders made on it, sessions, relevance judgments, the ruleset
the search runs today, and a proposed change to that ruleset.

Everything here is fictional. Corrin Sound Transit is the public transport
operator of the city of Halvering and the towns around the Corrin Sound, a
sea inlet. It runs buses (numbered routes, `X` express routes, `N` night
buses and `P` park and ride buses), three tram lines (the Harbour, Campus and
Valley lines, also called light rail) and the Sound Ferry between Harbour Quay
and Ferrisham Pier. Riders pay with contactless, in the Corrin Journeys app or
with the Wayfare card, the operator's smart card. The help centre covers fares
and passes (student, senior, university and Access passes, concession fares,
season tickets), timetables and service changes, works and diversions,
accessibility, bikes, prams and luggage, lost property and left luggage,
refunds and delay compensation, night services, express routes, park and
ride, the ferry, safety and operator news.

## Files

| file | what it holds | lines |
| --- | --- | --- |
| `documents.jsonl` | help-centre articles | {documents} |
| `queries.jsonl` | the search log, one line per distinct query | {queries} |
| `sessions.jsonl` | search sessions | {sessions} |
| `judgments.qrels` | graded relevance judgments, TREC format | {qrels} |
| `judged-queries.tsv` | the text of each judged query | {judged} |
| `judgments.csv` | the same judgments as CSV (plus a header line) | {qrels} |
| `proposed/` | the proposed ruleset (a complete ruleset directory) | |
| `generator/` | the generator and a checker | |

The live ruleset is in `../rules/`.

### documents.jsonl

One JSON object per line, sorted by `id`:

- `id`: the article id, `kb-0001` to `kb-{last_id}`.
- `title`: the article title, unique.
- `body`: the article text. Paragraphs are separated by a blank line
  (`\\n\\n`); a few articles have short lists with lines starting `- `.
  Lengths range from one sentence to several hundred words.
- `section`: one of {sections} help-centre sections, for example
  `Fares and tickets`, `Accessibility` or `Lost property and left luggage`.
- `updated`: the date the article was last changed, ISO 8601 (`YYYY-MM-DD`),
  between 2024 and 2026.

{hand} of the articles are hand-written; the rest are service notices
(timetable changes, diversions, tram works, stop changes, events, monthly
performance reports, route pages) built from varied templates, as a real
help centre's notices are.

### queries.jsonl

The search log aggregated by distinct query. One JSON object per line, sorted
by `count` descending, then by `query` ascending:

- `query`: the query as riders typed it, lowercased and with spaces
  collapsed. Includes typos, one-word and multi-word queries, and questions.
- `count`: how many times the query was searched.
- `clicks`: article id to the number of clicks on that article from this
  query's result pages, highest first. May be `{{}}`. The clicks of a query
  never add up to more than its `count`. Clicks were recorded under the live
  ruleset, so a query that found nothing relevant has few or no clicks.

{queries} distinct queries, {searches} searches and {clicks} clicks in total.
Traffic has a long tail: the busiest query was searched 9,000 times, and
{ones} queries only once.

### sessions.jsonl

One search session per line, in order, {session_searches} searches in all:

- `session`: the session id, `s-000001` to `s-{last_session}`.
- `searches`: the searches in the order the rider made them; each has
  `query` (exactly as in `queries.jsonl`) and `clicks`, the list of article
  ids the rider clicked, in click order (may be empty).

Many sessions are reformulations: a rider tries one wording, then another
(`stroller` then `pushchair`, `uni pass` then `university pass`, a typo then
its correction). Sessions are a sample of the log: a query appears in
sessions no more often than its `count`, and an article is clicked in
sessions no more often than in the query's `clicks`.

### Judgments

{judged} queries are judged, from the busiest to ones searched a handful of
times, with {pool_min} to {pool_max} judged articles each ({qrels} judgments). Grades:

- `3`: answers the query directly;
- `2`: answers it in part, or is the right article for a closely related need;
- `1`: on the topic but not much help;
- `0`: not relevant (a keyword search might still return it).

Judged articles were pooled the usual way: the top articles of keyword
searches for the query and for similar wordings, plus the best answers.
Articles not listed for a query have not been judged.

- `judgments.qrels`: TREC qrels, `QID 0 DOCID REL`, space-separated, sorted
  by QID and then DOCID. QIDs are `q001` to `q{last_qid}`, ordered by
  traffic.
- `judged-queries.tsv`: `QID<TAB>query`, the query text exactly as in
  `queries.jsonl`.
- `judgments.csv`: header `query_id,query,doc_id,relevance`, then the same
  rows as the qrels file, in the same order.

## Rulesets

`../rules/` is the ruleset the help centre runs today (see
`docs/rule-files.md` for the format):

- `pipeline.yaml`: English Snowball stemmer, lowercasing, a short stopword
  list;
- `synonyms.yaml`: {live_synonyms} synonym rules (equivalent sets and one-way
  rules), from light rail and tram to British and American spellings;
- `exempt.yaml`: route numbers, the Wayfare brand and two words kept out of
  the stemmer;
- `lemmas.yaml`: irregular forms such as children and buses.

`proposed/` is a proposed change, as a complete copy of the ruleset with the
change applied. Changed files have their `revision` bumped; the new file
starts at revision 1. The author describes it like this:

> **Search rules: stroller synonyms, accessibility wording, irregular verbs**
>
> - Add `stroller` and `buggy` to the pram set (`prams-and-pushchairs`).
>   Nobody writes "stroller" in our articles, so those searches found
>   nothing at all.
> - Add `transit card` to the `smart-card` set, and protect `transition`
>   from the stemmer (`zone-transition-notices`): "transit card" searches
>   were landing on the zone transition notices.
> - Add the accessibility wording set `accessible-travel` (universal,
>   accessible, step-free), so that the universal design pages, the
>   accessible travel guide and the step-free pages find each other.
> - Add `booking-changes` (change, amend, alter): the booking and account
>   pages say "amend" or "alter" where riders type "change".
> - Add `uni` → `university`, `enquiry` / `inquiry`, and
>   `compensation` → `refund`.
> - Import irregular verb forms from WordNet 3.0 (`irregular-verbs.yaml`,
>   {irregular} lemma overrides generated from `verb.exc`), so that past
>   tenses and participles match their base forms ("took", "ran", "fell",
>   "bought"...) the way our hand-written lemmas already do for "rode" and
>   "paid".

## Regenerating

All files above, the live ruleset in `../rules/` and `proposed/` are written
by the generator; change `generator/*.py`, not the output files. From the
repository root:

```sh
python3 demo-corpus/generator/make_demo.py     # Python 3.11, standard library only
python3 demo-corpus/generator/check_demo.py    # checks the invariants above
```

The generator uses a fixed seed: running it again gives byte-identical
files. It reads WordNet's verb exception list from
`/usr/share/wordnet/verb.exc` (Debian package `wordnet-base`; another path
can be given with `--verb-exc`). Without that file it keeps the existing
`proposed/irregular-verbs.yaml`.

## Counts

| | |
| --- | --- |
| articles | {documents} |
| distinct queries | {queries} |
| searches | {searches} |
| clicks | {clicks} |
| sessions | {sessions} |
| searches in sessions | {session_searches} |
| judged queries | {judged} |
| judgments (qrels lines) | {qrels} |
| lemma overrides in the WordNet import | {irregular} |
"""


def render(stats):
    s = dict(stats)
    s["last_id"] = f"{stats['documents']:04d}"
    s["last_session"] = f"{stats['sessions']:06d}"
    s["last_qid"] = f"{stats['judged']:03d}"
    for k, v in stats.items():
        if isinstance(v, int):
            s[k] = f"{v:,}"
    return TEMPLATE.format(**s)
