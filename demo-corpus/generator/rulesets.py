"""The live ruleset (rules/) and the proposed change (demo-corpus/proposed/),
as the YAML text the generator writes.

Files that the proposed change does not touch are written identically in
both directories.  The WordNet import (irregular-verbs.yaml) is built from
verb.exc by make_demo.py.
"""

PIPELINE = """\
# Text normalization for the help-centre search (buses, trams, Sound Ferry).
# Owned by the digital customer team. Every change goes through review and
# the search quality check in CI.
format: 1
revision: 3

pipeline:
  stemmer: english
  lowercase: true
  # Keep this list short. Words such as "out", "off", "before" and "after"
  # matter in queries like "tap out" or "senior pass before 9.30".
  stopwords: [a, an, and, the, of, to, for, on, in, at, my, is, i, do, how, can, what, with]
"""

SYNONYMS_HEAD = """\
# Synonyms for the help-centre search.
#
# `equivalent` members are interchangeable; `one_way` means searching for
# `from` also finds `to`, but not the other way round. Multi-word members
# are phrases. Please give every new rule an id and say why it exists.
format: 1
revision: {revision}

synonyms:
"""

# Each block is one rule, in file order.  Blocks marked LIVE are in both
# rulesets, PROPOSED only in the proposed one; CHANGED ones differ.
SYN_VEHICLES = """\
  # --- vehicles and modes ---------------------------------------------------
  - id: tram-light-rail
    note: the network is officially "light rail"; riders say tram
    equivalent: [tram, light rail]
  - id: boat-to-ferry
    one_way:
      from: boat
      to: [ferry]
  - id: bike-words
    equivalent: [bike, bicycle, cycle]
  - id: e-scooter
    equivalent: [e-scooter, electric scooter]
  - id: rail-replacement
    note: the buses say "Tram replacement" on the front
    equivalent: [rail replacement, replacement bus, tram replacement]
  - id: express
    equivalent: [express bus, express route, limited stop]
  - id: night-services
    equivalent: [night bus, late bus, night service]
"""

SYN_TICKETS_LIVE = """\
  # --- tickets, cards and fares --------------------------------------------
  - id: smart-card
    note: Wayfare is the brand name; riders call the card all of these
    equivalent: [wayfare card, smart card, travel card]
"""

SYN_TICKETS_PROPOSED = """\
  # --- tickets, cards and fares --------------------------------------------
  - id: smart-card
    note: Wayfare is the brand name; riders call the card all of these
    equivalent: [wayfare card, smart card, travel card, transit card]
"""

SYN_TICKETS_REST = """\
  - id: timetable
    equivalent: [timetable, schedule]
  - id: top-up
    equivalent: [top up, recharge, add credit]
  - id: contactless
    equivalent: [contactless, tap and pay]
  # "How much is ..." questions should reach the fares pages.
  - id: price-to-fare
    one_way:
      from: price
      to: [fare]
  - id: cost-to-fare
    one_way:
      from: cost
      to: [fare]
  - id: fine-to-penalty-fare
    note: riders call a penalty fare a fine
    one_way:
      from: fine
      to: [penalty fare]
  - id: season-ticket
    equivalent: [season ticket, monthly pass, annual pass]
  - id: concession
    equivalent: [concession fare, reduced fare, discount fare]
  - id: senior-pass
    equivalent: [senior pass, pensioner pass, free bus pass]
  - id: student-pass
    equivalent: [student pass, student card, college pass]
  - id: refund-to-compensation
    note: >
      after a delay people ask for a "refund"; the delay compensation
      scheme is what they are after. One way on purpose: compensation
      searches should not fill up with ticket refund pages.
    one_way:
      from: refund
      to: [compensation]
"""

SYN_CHANGE = """\
  # --- changing vehicles ---------------------------------------------------
  - id: vehicle-change
    note: changing between bus, tram and ferry
    equivalent: [change, transfer, connection]
"""

SYN_LUGGAGE_LIVE = """\
  # --- luggage, prams, lost property ---------------------------------------
  - id: pram-pushchair
    equivalent: [pram, pushchair]
"""

SYN_LUGGAGE_PROPOSED = """\
  # --- luggage, prams, lost property ---------------------------------------
  - id: prams-and-pushchairs
    note: >
      "stroller" and "buggy" are what visitors and many parents type;
      no article uses "stroller", so those searches found nothing
    equivalent: [pram, pushchair, stroller, buggy]
"""

SYN_LUGGAGE_REST = """\
  - id: luggage
    equivalent: [luggage, baggage]
  - id: luggage-storage
    note: the office is signed "Left luggage"
    one_way:
      from: luggage storage
      to: [left luggage]
  - id: lost-property
    equivalent: [lost property, lost and found]
"""

SYN_ACCESS = """\
  # --- accessibility -------------------------------------------------------
  - id: lift-elevator
    equivalent: [lift, elevator]
  - id: wheelchair-mobility-aid
    one_way:
      from: wheelchair
      to: [mobility aid]
  - id: step-free
    equivalent: [step-free, level access, level boarding]
  - equivalent: [toilet, restroom, washroom]
"""

SYN_SPELLING = """\
  # --- British and American spelling ---------------------------------------
  - id: tyre-tire
    equivalent: [tyre, tire]
  - id: kerb-curb
    equivalent: [kerb, curb]
  - id: colour-color
    equivalent: [colour, color]
  - id: centre-center
    equivalent: [centre, center]
  - id: organise-organize
    equivalent: [organise, organize]
  - equivalent: [travelling, traveling]
"""

SYN_PLACES = """\
  # --- places and services -------------------------------------------------
  - id: park-and-ride
    note: both spellings appear on signs
    equivalent: [park and ride, park-and-ride]
  - id: diversion
    equivalent: [diversion, detour]
  - equivalent: [roadworks, road works]
  - id: contact
    equivalent: [general enquiries, contact us, customer service]
  - id: airport-to-x40
    one_way:
      from: airport
      to: [x40]
"""

SYN_PROPOSED_NEW = """\
  # --- added in revision 13 ------------------------------------------------
  # Accessibility wording: the universal design pages, the accessible travel
  # guide and the step-free pages describe the same thing in different words.
  - id: accessible-travel
    equivalent: [universal, accessible, step-free]
  # Booking and account pages say "amend" or "alter"; riders type "change".
  - id: booking-changes
    equivalent: [change, amend, alter]
  # Students shorten it; the pass pages always say "university".
  - id: uni-to-university
    one_way:
      from: uni
      to: [university]
  # Visitors and international students use the American spelling.
  - id: enquiry-spelling
    equivalent: [enquiry, inquiry]
  # Riders asking about compensation often want a refund of the ticket too.
  - id: compensation-to-refund
    one_way:
      from: compensation
      to: [refund]
"""


def synonyms_live():
    return (SYNONYMS_HEAD.format(revision=12) + SYN_VEHICLES + SYN_TICKETS_LIVE
            + SYN_TICKETS_REST + SYN_CHANGE + SYN_LUGGAGE_LIVE + SYN_LUGGAGE_REST
            + SYN_ACCESS + SYN_SPELLING + SYN_PLACES)


def synonyms_proposed():
    return (SYNONYMS_HEAD.format(revision=13) + SYN_VEHICLES + SYN_TICKETS_PROPOSED
            + SYN_TICKETS_REST + SYN_CHANGE + SYN_LUGGAGE_PROPOSED + SYN_LUGGAGE_REST
            + SYN_ACCESS + SYN_SPELLING + SYN_PLACES + SYN_PROPOSED_NEW)


EXEMPT_HEAD = """\
# Surface forms that the lemma and stem stages must leave alone.
format: 1
revision: {revision}

exempt:
  # Route numbers (14, 14a, x40, n7, p1) must match exactly.
  - id: route-numbers
    pattern: "^[a-z]?\\\\d{{1,3}}[a-z]?$"
    note: bus, express (x), night (n) and park and ride (p) route numbers
  - id: brand-wayfare
    term: wayfare
    note: the card brand; the stemmer would turn it into "wayfar"
  - id: keep-news
    term: news
    note: keep operator news apart from "new"
  # The Little Universe stop was matching university pass searches.
  - id: stop-little-universe
    term: universe
"""

EXEMPT_PROPOSED_NEW = """\
  # "transit card" searches were landing on the zone transition notices,
  # because the stemmer reduces "transition" to "transit".
  - id: zone-transition-notices
    pattern: "^transition(s|al)?$"
    note: covers transition, transitions and transitional
"""


def exempt_live():
    return EXEMPT_HEAD.format(revision=4)


def exempt_proposed():
    return EXEMPT_HEAD.format(revision=5) + EXEMPT_PROPOSED_NEW


LEMMAS = """\
# Irregular forms that the stemmer does not bring together.
format: 1
revision: 2

lemmas:
  - id: buses
    form: buses
    lemma: bus
    note: Snowball turns "buses" into "buse" but leaves "bus" alone
  - id: busses
    form: busses
    lemma: bus
  - id: children
    form: children
    lemma: child
  - id: rode
    form: rode
    lemma: ride
  - id: ridden
    form: ridden
    lemma: ride
  - id: paid
    form: paid
    lemma: pay
    note: '"paid twice" should find the payment pages'
"""

IRREGULAR_HEAD = """\
# Irregular verb forms, imported from WordNet 3.0 (verb.exc, the verb
# exception list shipped with the wordnet-base package).
#
# Imported mechanically: one override per line of verb.exc. Lines that list
# more than one base form were skipped, as were multi-word and hyphenated
# entries, entries whose form equals the base, and forms that lemmas.yaml
# already covers. Regenerate with demo-corpus/generator/make_demo.py rather
# than editing by hand.
format: 1
revision: 1

lemmas:
"""


def parse_synonyms(text):
    """Tiny reader for the synonym files above (only the shapes used here).

    Returns a list of (kind, members) where kind is "eq" or "ow" and, for
    one-way rules, members is (from, [to...]).
    """
    rules = []
    lines = text.splitlines()
    i = 0
    while i < len(lines):
        s = lines[i].strip()
        if s.startswith("- "):
            s2 = s[2:]
        else:
            s2 = s
        if s2.startswith("equivalent:"):
            inner = s2.split("[", 1)[1].rsplit("]", 1)[0]
            rules.append(("eq", [m.strip() for m in inner.split(",")]))
        elif s2.startswith("one_way:"):
            frm = lines[i + 1].strip().split(":", 1)[1].strip()
            inner = lines[i + 2].strip().split("[", 1)[1].rsplit("]", 1)[0]
            rules.append(("ow", (frm, [m.strip() for m in inner.split(",")])))
            i += 2
        i += 1
    return rules
