"""Generated notices: route timetables, diversions, works, stops, events,
performance reports, express and night route pages, ferry notices.

Everything here is driven by a random.Random passed in by make_demo.py, so
the output depends only on the fixed seed.
"""

import datetime as dt

from articles_a import (S_TIMES, S_WORKS, S_NEWS, S_EXPRESS, S_NIGHT,
                        S_FERRY, S_ACCESS, S_BIKES, S_LOST, S_PASSES,
                        S_FARES, S_TRAMS, S_CARD, S_SAFETY, S_PNR)

# ------------------------------------------------------------------ world data
# route -> (end A, end B, main street, area)
BUS_ROUTES = {
    "1": ("Halvering Central", "Eastgate", "Castle Street", "Eastgate"),
    "2": ("Halvering Central", "Saltings", "Harbour Road", "Saltings"),
    "3": ("Halvering Central", "Morrow Green", "Orchard Rise", "Morrow Green"),
    "4": ("Market Cross", "Kestrel Park", "Kestrel Way", "Kestrel Park"),
    "5": ("Halvering Central", "Cathedral Green", "Church Lane", "the Cathedral Quarter"),
    "6": ("Harbour Quay", "Quarry Hill", "Quarry Road", "Quarry Hill"),
    "7": ("Halvering Central", "Harbour Quay", "Wharf Street", "the harbour"),
    "8": ("Eastgate", "St Brenna's Hospital", "Heron Road", "Heron Bay"),
    "9": ("Halvering Central", "Oakhithe", "Tallow Street", "Oakhithe"),
    "10": ("Market Cross", "Linnet Fields", "Linnet Road", "Linnet Fields"),
    "11": ("Halvering Central", "Marsh End", "Marsh Road", "Marsh End"),
    "12": ("Halvering Central", "Cawley Heath", "Cawley Road", "Cawley Heath"),
    "14": ("Halvering Central", "Morrow Green", "Mill Lane", "Mill Lane"),
    "14a": ("Halvering Central", "Orchard Rise", "Mill Lane", "Orchard Rise"),
    "15": ("St Brenna's Hospital", "Harbour Quay", "Dockside Avenue", "Dockside"),
    "16": ("Halvering Central", "Copper Lane", "Copper Lane", "Copper Lane"),
    "18": ("Stonesend", "Quarry Hill", "Tanners Hill", "Tanners Hill"),
    "20": ("Halvering Central", "Linnet Fields", "Weavers Way", "Linnet Fields"),
    "20b": ("Halvering Central", "Linnet Vale", "Weavers Way", "Linnet Vale"),
    "21": ("Eastgate", "Pellow Bay", "Pellow Road", "Pellow"),
    "22": ("Halvering Central", "Heron Bay", "Heron Road", "Heron Bay"),
    "24": ("Market Cross", "University Campus", "Bellfounders Street", "the university"),
    "25": ("Halvering Central", "Tallow Bridge", "Tallow Street", "Tallow Bridge"),
    "27": ("Oakhithe", "Stonesend", "Brewery Lane", "Oakhithe"),
    "30": ("Stonesend", "Halvering Central", "Stonesend Road", "Stonesend"),
    "31": ("Stonesend", "Cawley Heath", "Stonesend Road", "Cawley Heath"),
    "33": ("Stonesend", "Linnet Vale", "Salt Lane", "Linnet Vale"),
    "35": ("Ferrisham Pier", "Ferrisham Town", "Sailmakers Row", "Ferrisham"),
    "36": ("Ferrisham Town", "Ravensby", "Ravensby Road", "Ravensby"),
    "40": ("Halvering Central", "Copper Lane", "Foundry Street", "the east of the city"),
    "41": ("Halvering Central", "Kestrel Park", "Kestrel Way", "Kestrel Park"),
    "42": ("Eastgate", "Marsh End", "Marsh Road", "Marsh End"),
    "44": ("Halvering Central", "Copper Lane", "Chandlers Walk", "Copper Lane"),
    "45": ("Eastgate", "Quarry Hill", "Quarry Road", "Quarry Hill"),
    "48": ("Market Cross", "Heron Bay", "Ropewalk", "Heron Bay"),
    "50": ("Ferrisham Town", "Tallow Bridge", "Tallow Bridge Road", "Tallow Bridge"),
    "52": ("Ferrisham Pier", "Ravensby", "Ravensby Road", "Ravensby"),
    "55": ("Halvering Central", "Pellow Bay", "Pellow Road", "Pellow Bay"),
    "60": ("Stonesend", "Oakhithe", "Brewery Lane", "Oakhithe"),
    "61": ("Stonesend", "Brindle Fell", "Fell Road", "Brindle Fell"),
    "66": ("Halvering Central", "Saltings", "Sailmakers Row", "Saltings"),
    "70": ("Linnet Vale", "Oakhithe", "Orchard Rise", "Linnet Vale"),
    "72": ("Linnet Vale", "Ravensby", "Linnet Road", "the valley villages"),
    "88": ("Halvering Central", "St Brenna's Hospital", "Castle Street", "the hospital"),
    "90": ("Cawley Heath", "Brindle Fell", "Fell Road", "Cawley Heath"),
    "99": ("Halvering Central", "the airport", "Eastgate Road", "the airport road"),
}

EXPRESS_ROUTES = {
    "X1": ("Halvering Central", "Pellow Bay", ["Eastgate", "Pellow Road"], 25),
    "X3": ("Halvering Central", "Stonesend", ["Market Cross", "Stonesend Road"], 22),
    "X7": ("Halvering Central", "Morrow Green", ["Orchard Rise"], 19),
    "X12": ("Ferrisham Pier", "Ravensby", ["Ferrisham Town"], 28),
    "X20": ("Stonesend", "Cawley Heath", ["Brindle Fell"], 24),
    "X40": ("Halvering Central", "the airport", ["Harbour Quay", "Eastgate"], 35),
    "X55": ("Linnet Vale", "Halvering Central", ["Stonesend", "Market Cross"], 27),
}

NIGHT_ROUTES = {
    "N1": ("Halvering Central", "Eastgate", "the Harbour Line"),
    "N4": ("Halvering Central", "Morrow Green", "the Campus Line"),
    "N7": ("Halvering Central", "Linnet Vale", "the Valley Line"),
    "N9": ("Halvering Central", "the student village", "route 24"),
    "N14": ("Halvering Central", "Orchard Rise", "route 14"),
    "N22": ("Halvering Central", "Heron Bay", "route 22"),
    "N33": ("Stonesend", "Linnet Vale", "route 33"),
}

TRAM_LINES = {
    "Harbour Line": ["Eastgate", "Castle Street", "Halvering Central", "Opera House", "Ropewalk", "Harbour Quay", "Saltings"],
    "Campus Line": ["Halvering Central", "Cathedral Green", "Bellfounders Street", "University Campus", "Little Universe", "Orchard Rise", "Morrow Green"],
    "Valley Line": ["Halvering Central", "Market Cross", "Tanners Hill", "Old Foundry", "Stonesend Interchange", "Linnet Fields", "Linnet Vale"],
}

STREETS = ["Mill Lane", "Foundry Street", "Quarry Road", "Chandlers Walk", "Tallow Street",
           "Salt Lane", "Kestrel Way", "Heron Road", "Orchard Rise", "Brewery Lane",
           "Wharf Street", "Sailmakers Row", "Linnet Road", "Copper Lane", "Bellfounders Street",
           "Weavers Way", "Marsh Road", "Tanners Hill", "Castle Street", "Harbour Road",
           "Church Lane", "Pellow Road", "Cawley Road", "Stonesend Road", "Dockside Avenue",
           "Fell Road", "Ravensby Road", "Eastgate Road", "Ropewalk", "Market Street"]

STOPS = ["Market Cross", "Cathedral Green", "Opera House", "Castle Street", "Eastgate",
         "Saltings", "Harbour Quay", "Ropewalk", "Morrow Green", "Orchard Rise",
         "Linnet Fields", "Kestrel Park", "Heron Bay", "Quarry Hill", "Copper Lane",
         "St Brenna's Hospital", "Tallow Bridge", "Oakhithe", "Marsh End", "Pellow Bay",
         "Ferrisham Town", "Ravensby", "Tanners Hill", "Old Foundry", "Little Universe",
         "University Campus", "Bellfounders Street", "Brindle Fell", "Stonesend Interchange",
         "Cawley Heath"]

TRAM_ONLY = {"Little Universe", "Old Foundry", "Tanners Hill", "Bellfounders Street"}
BUS_STOPS = [s for s in STOPS if s not in TRAM_ONLY]

WEEKDAYS = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"]
MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August",
          "September", "October", "November", "December"]


def fmt_date(d):
    return f"{d.day} {MONTHS[d.month - 1]} {d.year}"


def fmt_day(d):
    return f"{WEEKDAYS[d.weekday()]} {d.day} {MONTHS[d.month - 1]}"


def rand_date(rng, start=dt.date(2024, 1, 8), end=dt.date(2026, 6, 20)):
    return start + dt.timedelta(days=rng.randrange((end - start).days))


def hhmm(minutes):
    return f"{minutes // 60:02d}:{minutes % 60:02d}"


def pick(rng, seq, k):
    return rng.sample(seq, k)


# ------------------------------------------------------------------ timetable notices
TT_TITLES = [
    "Route {r}: new timetable from {date}",
    "Changes to route {r} from {day}",
    "Timetable update for the {r} ({a} – {b})",
    "Route {r} timetable changes, {month} {year}",
    "New times for route {r}",
    "Route {r}: what's changing on {day}",
    "More buses on route {r}",
    "Route {r} ({a} to {b}): revised timetable",
]
TT_INTROS = [
    "From {day}, route {r} between {a} and {b} will run to a new timetable.",
    "We are changing the timetable on route {r} from {date}.",
    "Route {r} gets new times from {day}. Here is a summary of what is changing and why.",
    "A new timetable for the {r} starts on {date}.",
    "The timetable for route {r}, which links {a} with {b} via {street}, changes on {date}.",
    "On {day} route {r} moves to a revised timetable.",
]
TT_REASONS = [
    "The change follows feedback from passengers who told us that the morning buses were too full.",
    "Roadworks on {street} have finished, so we can bring back the normal route and running times.",
    "New homes at {area} mean more people are travelling, and we are adding journeys to match.",
    "We have reviewed journey times using data from the past year. Buses on this route often ran late in the afternoon, so we are allowing more time between stops.",
    "The change lines up departures with the {line} trams at {stop}, so the connection is shorter.",
    "School term times have changed, so the school-day journeys move by a few minutes.",
    "Fewer people use the late evening journeys, so we are moving those buses to the busier daytime service.",
    "Drivers told us that the old timetable left too little time at {b} to recover from delays. The new times are more realistic.",
    "Since the new supermarket opened on {street}, Saturday traffic has grown and the buses ran up to ten minutes late.",
]
TT_CHANGES = [
    "Monday to Saturday daytime buses will run every {n} minutes instead of every {m} minutes.",
    "The first bus from {a} will leave at {t1}, {k} minutes earlier than today.",
    "The last bus from {b} will now leave at {t2}.",
    "On Sundays buses will run every {n2} minutes from {t3} until the early evening.",
    "Buses will no longer serve {street2} after 19:00; please use the stop on {street} instead.",
    "Some evening journeys will be extended to {stop}.",
    "Journey times are generally unchanged, but departures at most stops move by up to {k} minutes.",
    "Buses generally run every {n} minutes during the day and every {n2} minutes in the evening.",
    "The 07:{mm} journey from {b} will run every school day, not only in term.",
    "Saturday buses will run every {n} minutes between 09:00 and 18:00.",
    "Two extra early journeys will leave {a} at {t1} and {t4} for hospital and shift workers.",
]
TT_CLOSINGS = [
    "The new timetable is in the Corrin Journeys app and the journey planner from {date2}.",
    "Printed timetables will be available on board and at Halvering Central Travel Centre from {date2}.",
    "If you have questions about the change, please contact our general enquiries team.",
    "You can see the full timetable on the route {r} page.",
    "Live times in the app will show the new timetable from the day it starts.",
    "",
    "",
]


def timetable_notice(rng, r):
    a, b, street, area = BUS_ROUTES[r]
    eff = rand_date(rng)
    upd = eff - dt.timedelta(days=rng.randint(5, 24))
    line = rng.choice(list(TRAM_LINES))
    slots = dict(
        r=r, a=a, b=b, street=street, area=area,
        street2=rng.choice([s for s in STREETS if s != street]),
        stop=rng.choice(TRAM_LINES[line][1:]), line=line,
        date=fmt_date(eff), day=fmt_day(eff), month=MONTHS[eff.month - 1], year=eff.year,
        date2=fmt_date(eff - dt.timedelta(days=rng.randint(7, 14))),
        n=rng.choice([8, 10, 12, 15, 20]), m=rng.choice([12, 15, 20, 30]),
        n2=rng.choice([20, 30, 60]), k=rng.choice([5, 10, 15, 20]),
        t1=hhmm(rng.randint(5 * 60, 6 * 60 + 30)), t2=hhmm(rng.randint(22 * 60, 23 * 60 + 45)),
        t3=hhmm(rng.choice([7 * 60 + 30, 8 * 60, 8 * 60 + 30, 9 * 60])),
        t4=hhmm(rng.randint(6 * 60 + 31, 6 * 60 + 55)), mm=f"{rng.randint(5, 55):02d}",
    )
    if slots["n"] >= slots["m"]:
        slots["m"] = slots["n"] + 5
    title = rng.choice(TT_TITLES).format(**slots)
    paras = [rng.choice(TT_INTROS) + " " + rng.choice(TT_REASONS)]
    changes = pick(rng, TT_CHANGES, rng.randint(1, 4))
    if len(changes) == 1 or rng.random() < 0.5:
        paras.append(" ".join(changes))
    else:
        paras.append("What is changing:\n" + "\n".join("- " + c for c in changes))
    closing = rng.choice(TT_CLOSINGS)
    if closing:
        paras.append(closing)
    body = "\n\n".join(p.format(**slots) for p in paras)
    return dict(section=S_TIMES, title=title, tags=f"timetable-route service-change route:{r}",
                body=body, updated=upd)


# ------------------------------------------------------------------ diversions
WORKS = [
    ("gas main replacement", "gas works"), ("water main repairs", "water main repairs"),
    ("resurfacing", "resurfacing"), ("a new pedestrian crossing", "crossing works"),
    ("bridge inspections", "bridge inspections"), ("tree works", "tree works"),
    ("drainage works", "drainage works"), ("kerb and footway works", "kerb works"),
    ("a street market", "a street market"), ("utility works", "utility works"),
    ("the demolition of the old depot", "demolition works"), ("a new cycle lane", "cycle lane works"),
    ("sewer repairs", "sewer repairs"), ("a film shoot", "filming"),
]
DV_TITLES = [
    "Route {r} diversion: {street} closed",
    "{street} closure: routes {r} and {r2} diverted",
    "Roadworks on {street}: changes to route {r}",
    "Diversion for routes {r} and {r2}: {work_short}",
    "Route {r}: temporary diversion from {day}",
    "{street}: buses diverted for {work_short}",
]
DV_OPEN = [
    "Because of {work} on {street}, route {r} is diverted from {date} until {date2}.",
    "{street} will be closed from {day} for {work}. Routes {r} and {r2} will be diverted while the road is closed.",
    "From {date}, the council is carrying out {work} on {street}. Buses on route {r} cannot use the road and will follow a diversion.",
    "Route {r} is diverted away from {street} for about {weeks} weeks during {work}.",
]
DV_ROUTE = [
    "Buses towards {b} will turn left at {street3}, continue along {street4} and rejoin the normal route at {stop}.",
    "Buses heading towards {a} will turn right into {street4} and then left onto {street3}.",
    "Buses in both directions will use {street3} and {street4} instead.",
    "Towards {b}, buses will turn left out of {street3} and follow {street4} to {stop}; towards {a}, they will do the same in reverse.",
]
DV_STOPS = [
    "Stops on {street} will not be served. Temporary stops are in place on {street3}; look for the yellow signs.",
    "The stop at {stop} moves about {d} metres along the road, just past the junction.",
    "All stops between {stop} and {street4} are closed. The nearest open stop is on {street3}.",
    "Please check the stop notices before you travel, as some stops will be closed at short notice.",
]
DV_EXTRA = [
    "Please allow an extra {k} minutes for your journey.",
    "The works include new raised kerbs at two stops, which will make boarding easier for everyone once finished.",
    "Contractors will be resurfacing the road and replacing the kerb line at the same time.",
    "Night buses {nr} follow the same diversion.",
    "The closure is expected to end on {date2}, but the date may change depending on the weather.",
    "We are sorry for the disruption, and thank you for your patience.",
    "Journey times are generally longer during the morning peak, so please leave extra time.",
    "The council has told us that the road will reopen in stages; we will update this page as each stage finishes.",
    "Drivers will not be able to stop between stops while the diversion is in place.",
]


def diversion_notice(rng, r):
    a, b, street, area = BUS_ROUTES[r]
    others = [x for x in BUS_ROUTES if x != r and BUS_ROUTES[x][2] == street]
    r2 = others[0] if others else rng.choice([x for x in BUS_ROUTES if x != r])
    start = rand_date(rng)
    weeks = rng.randint(2, 9)
    end = start + dt.timedelta(days=7 * weeks)
    upd = start - dt.timedelta(days=rng.randint(2, 12))
    work, work_short = rng.choice(WORKS)
    s3, s4 = pick(rng, [s for s in STREETS if s != street], 2)
    slots = dict(r=r, r2=r2, a=a, b=b, street=street, street3=s3, street4=s4,
                 stop=rng.choice(BUS_STOPS), work=work, work_short=work_short,
                 date=fmt_date(start), day=fmt_day(start), date2=fmt_date(end), weeks=weeks,
                 d=rng.choice([50, 80, 100, 150, 200]), k=rng.choice([5, 10, 15]),
                 nr=rng.choice(list(NIGHT_ROUTES)))
    title = rng.choice(DV_TITLES).format(**slots)
    paras = [rng.choice(DV_OPEN), rng.choice(DV_ROUTE) + " " + rng.choice(DV_STOPS)]
    extra = pick(rng, DV_EXTRA, rng.randint(0, 3))
    if extra:
        paras.append(" ".join(extra))
    body = "\n\n".join(p.format(**slots) for p in paras)
    return dict(section=S_WORKS, title=title, tags=f"diversion route:{r} route:{r2}",
                body=body, updated=upd)


# ------------------------------------------------------------------ tram works
TW_TITLES = [
    "No trams between {s1} and {s2}: {date} to {date2}",
    "Rail replacement buses on the {line}, {month} {year}",
    "{line} closure for track works",
    "Tram works: {line} part-closed from {day}",
]
TW_BODY = [
    "There will be no {line} trams between {s1} and {s2} from {date} to {date2} while we {task}. Rail replacement buses run every {n} minutes between the closed stops.",
    "Replacement buses stop on the nearest main road to each tram stop. Yellow signs at the tram stops show the way. Tram tickets and passes are valid on the buses.",
    "Rail replacement buses are step-free with a ramp, but full-size bikes cannot be carried. Folding bikes and prams are welcome.",
    "Trams run as normal on the rest of the {line}. If you are travelling from {s2}, you may find it quicker to take route {r} instead.",
    "Journeys will take up to {k} minutes longer than usual. The journey planner includes the replacement buses.",
    "Please leave extra time if you are connecting with the ferry at Harbour Quay.",
]
TW_TASKS = ["renew the track", "replace the overhead line", "repair a bridge", "rebuild the platform at {s1}",
            "install new signals", "resurface the tram crossing at {s2}"]


def tram_works_notice(rng):
    line = rng.choice(list(TRAM_LINES))
    stops = TRAM_LINES[line]
    i = rng.randrange(len(stops) - 2)
    j = rng.randint(i + 1, min(i + 3, len(stops) - 1))
    s1, s2 = stops[i], stops[j]
    start = rand_date(rng)
    end = start + dt.timedelta(days=rng.choice([1, 2, 9, 16, 23]))
    upd = start - dt.timedelta(days=rng.randint(7, 30))
    task = rng.choice(TW_TASKS).format(s1=s1, s2=s2)
    slots = dict(line=line, s1=s1, s2=s2, date=fmt_date(start), date2=fmt_date(end),
                 day=fmt_day(start), month=MONTHS[start.month - 1], year=start.year, task=task,
                 n=rng.choice([5, 8, 10, 12]), k=rng.choice([10, 15, 20]),
                 r=rng.choice(list(BUS_ROUTES)))
    title = rng.choice(TW_TITLES).format(**slots)
    body = "\n\n".join([TW_BODY[0], " ".join(pick(rng, TW_BODY[1:], rng.randint(2, 4)))]).format(**slots)
    return dict(section=S_WORKS, title=title, tags="rail-replacement tram-works", body=body, updated=upd)


# ------------------------------------------------------------------ stop notices
STOP_NOTICES = [
    ("Bus stop moving on {street}", "The stop on {street} near {stop} is moving {d} metres towards the junction from {date}, to make room for a new crossing. The new stop has a raised kerb and a shelter. Routes {r} and {r2} use the new stop."),
    ("{stop}: stop closed from {day}", "The stop at {stop} on {street} is closed from {date} for {weeks} weeks while the pavement is rebuilt. Use the temporary stop on the opposite corner, or the next stop on {street2}."),
    ("New shelter and seating at {stop}", "We have installed a new shelter with seating, lighting and a real-time screen at {stop}. The shelter follows our universal design standard, with a clear space for a wheelchair and a contrasting colour band on the glass."),
    ("Temporary stop for {stop} during building works", "While building works take place beside the stop, {stop} is served by a temporary stop about {d} metres away on {street}. Turn left out of the temporary stop to reach the main entrance."),
    ("Real-time screen out of order at {stop}", "The real-time screen at {stop} is out of order after storm damage. A replacement has been ordered and should be fitted by {date}. In the meantime, use the app or text the stop number on the pole."),
    ("{stop} stop: raised kerb works", "We are raising the kerb at {stop} from {date}, so the stop will be out of use for about a week. The works will bring the pavement level closer to the bus floor, making it easier to board with a wheelchair, a pram or heavy bags."),
]


def stop_notice(rng, k):
    title_t, body_t = STOP_NOTICES[k % len(STOP_NOTICES)]
    r, r2 = pick(rng, list(BUS_ROUTES), 2)
    d0 = rand_date(rng)
    slots = dict(stop=rng.choice(BUS_STOPS), street=rng.choice(STREETS), street2=rng.choice(STREETS),
                 d=rng.choice([30, 40, 60, 80, 120]), date=fmt_date(d0), day=fmt_day(d0),
                 weeks=rng.randint(2, 8), r=r, r2=r2)
    tags = "stop-notice"
    if "kerb" in body_t:
        tags += " access-kerb"
    if "universal design" in body_t:
        tags += " access-universal-design"
    return dict(section=S_WORKS, title=title_t.format(**slots), tags=tags,
                body=body_t.format(**slots), updated=d0 - dt.timedelta(days=rng.randint(3, 10)))


# ------------------------------------------------------------------ events
EVENTS = [
    # name, place, area, details, months it happens in
    ("the Harbour Festival", "the harbour", "the harbourside", "Extra ferries and trams run until 01:00, and the Harbour Line runs every 5 minutes from 17:00. Wharf Street is closed to traffic, so routes 7 and 15 are diverted.", [7]),
    ("the Halvering Half Marathon", "the city centre", "the race route", "Roads on the race route are closed from 07:00 to 13:00. Routes 1, 5, 14 and 22 are diverted, and trams do not run between Cathedral Green and University Campus until 12:30.", [4]),
    ("the fireworks at Pellow Bay", "Pellow Bay", "the seafront", "Extra buses run on routes 21, 55 and X1 after the display. Expect long queues at the seafront stops after 21:00; the walk to Pellow Road is quicker.", [11]),
    ("graduation week at Halvering University", "University Campus", "the campus", "Extra Campus Line trams run every 4 minutes between 09:00 and 18:00. Parking on campus is for guests with permits only, so we recommend the tram from Halvering Central.", [7, 12]),
    ("Halvering Athletic home matches", "the stadium at Kestrel Park", "the stadium", "Special buses run from Halvering Central and Brindle Fell park and ride two hours before kick-off. After the match, buses leave from the stadium coach park.", [1, 3, 9, 10]),
    ("the Christmas market", "Market Cross", "the market square", "Market Street is closed to buses from 10:00 on market days, and routes 4, 10 and 24 use temporary stops on Castle Street.", [12]),
    ("the Ferrisham regatta", "Ferrisham", "the waterfront", "The Sound Ferry runs every 15 minutes, and route 35 runs a shuttle between Ferrisham Pier and the regatta field.", [8]),
    ("the Opera House summer season", "the Opera House", "the Opera House", "An extra tram leaves Opera House for Halvering Central 15 minutes after each evening performance, and routes 2 and 66 run later on performance nights.", [6, 7, 8]),
    ("the Cathedral Green food fair", "Cathedral Green", "the green", "Church Lane is closed to traffic, so route 5 terminates at Castle Street. Trams call at Cathedral Green as normal.", [9]),
    ("the New Year's Eve celebrations", "the harbour", "the harbour", "Trams, the ferry and night buses run all night, and travel is free from 20:00 to 06:00 with any valid ticket or none at all.", [12]),
]


def event_notice(rng, k):
    name, place, area, detail, months = EVENTS[k % len(EVENTS)]
    year = rng.choice([2024, 2025, 2026])
    month = rng.choice(months)
    if year == 2026 and month > 6:
        year = 2025
    if "New Year" in name:
        d0 = dt.date(year if year < 2026 else 2025, 12, 31)
    else:
        d0 = dt.date(year, month, rng.randint(1, 28))
    cap = name[0].upper() + name[1:]
    titles = [f"Getting to {name}", f"Travel advice for {name}", f"Extra services for {name}",
              f"{cap}: how to get there", f"{cap} {d0.year}: travel information"]
    intro = rng.choice([
        f"{cap} takes place on {fmt_day(d0)} at {place}, and we expect it to be very busy.",
        f"We are running extra services for {name} on {fmt_day(d0)}.",
        f"If you are going to {name} on {fmt_day(d0)}, please plan ahead: roads around {area} will be busy.",
    ])
    if "matches" in name or "season" in name:
        intro = rng.choice([
            f"Here is how to get to {name} this year. The next one is on {fmt_day(d0)}.",
            f"We run extra services for {name}, starting on {fmt_day(d0)}.",
        ])
    tail = rng.choice(["", " Travel home can take longer than usual, so check the app for live times.",
                       " Please leave plenty of time and avoid driving if you can.",
                       " The park and ride sites stay open until midnight."])
    tags = "event-services"
    if "university" in name.lower():
        tags += " news-university"
    if "opera" in name.lower():
        tags += " stop-opera-house"
    return dict(section=S_NEWS, title=rng.choice(titles), tags=tags,
                body=intro + "\n\n" + detail + tail, updated=d0 - dt.timedelta(days=rng.randint(5, 20)))


# ------------------------------------------------------------------ performance reports
def performance_report(rng, year, month):
    bus = round(rng.uniform(86.0, 93.5), 1)
    tram = round(rng.uniform(93.0, 98.0), 1)
    lost_ferry = rng.randint(0, 40)
    lost_miles = round(rng.uniform(0.2, 2.4), 1)
    causes = rng.choice(["traffic congestion in the city centre", "roadworks on Stonesend Road",
                         "a shortage of drivers at the Pellow depot", "heavy snow on two days",
                         "a power failure on the Valley Line", "flooding on Marsh Road"])
    mname = MONTHS[month - 1]
    d0 = dt.date(year, month, 1) + dt.timedelta(days=40)
    paras = [
        f"In {mname} {year}, {bus}% of buses ran on time and {tram}% of trams ran within three minutes of the timetable.",
        f"The main cause of late running was {causes}. We lost {lost_miles}% of scheduled bus mileage, mostly to cancelled journeys, and the Sound Ferry lost {lost_ferry} sailings" + (" to bad weather." if lost_ferry > 10 else "."),
    ]
    if rng.random() < 0.6:
        paras.append(rng.choice([
            "Customer complaints fell by 8% compared with the same month last year. The most common subject was buses that left early or did not stop.",
            "Lifts at tram stops were available 98.7% of the time. The longest outage was at Opera House, where a lift was out of service for four days.",
            "We received 2,140 items of lost property, and 61% were returned to their owners.",
            "Delay compensation claims were paid within an average of six working days.",
        ]))
    return dict(section=S_NEWS, title=f"Service performance: {mname} {year}", tags="news-performance delay",
                body="\n\n".join(paras), updated=d0)


# ------------------------------------------------------------------ express and night route pages
def express_page(rng, r):
    a, b, via, mins = EXPRESS_ROUTES[r]
    freq = rng.choice([10, 12, 15, 20, 30])
    first = hhmm(rng.randint(5 * 60, 6 * 60 + 30))
    last = hhmm(rng.randint(21 * 60, 23 * 60 + 30))
    via_txt = " and ".join(via)
    paras = [
        f"The {r} express runs between {a} and {b}, calling only at {via_txt}. The journey takes about {mins} minutes, compared with up to {mins + 20} minutes on the regular routes.",
        f"Buses run every {freq} minutes from {first} to {last} on weekdays, and every {freq + 10} minutes at weekends. All regular tickets, passes and season tickets are valid, and the fare is the same as on any other bus.",
    ]
    extra = {
        "X40": "Large suitcases go in the luggage hold. At the airport, leave luggage with the driver only if it has a label; otherwise keep it with you in the rack.",
        "X12": "The X12 connects with the Sound Ferry at Ferrisham Pier. If the ferry is late, the last X12 waits up to ten minutes.",
        "X20": "The X20 has a rack for two bikes and stops at Brindle Fell park and ride.",
        "X3": "At Stonesend, the X3 stops at stand B of the interchange, next to the lifts to the Valley Line.",
    }.get(r)
    if extra:
        paras.append(extra)
    title = rng.choice([f"{r} express: {a} to {b}", f"{r} express route", f"The {r} express ({a} – {b})"])
    return dict(section=S_EXPRESS, title=title, tags=f"express-route route:{r.lower()}",
                body="\n\n".join(paras), updated=rand_date(rng))


def night_page(rng, r):
    a, b, follows = NIGHT_ROUTES[r]
    paras = [
        f"The {r} night bus runs from {a} to {b} every night, following {follows}. It leaves {a} at 00:15 and then every {rng.choice([30, 40, 60])} minutes until {hhmm(rng.choice([270, 285, 300]))}.",
        rng.choice([
            "On Friday and Saturday nights extra journeys run every 20 minutes until 03:00.",
            "The last journey waits for the final tram at Halvering Central on Friday and Saturday nights.",
            "The route is served by double-deck buses with CCTV on both decks.",
        ]),
        "The night bus fare is £3.00. Day tickets bought the previous day and all season tickets and passes are valid.",
    ]
    if r == "N9":
        paras.append("The N9 is funded by Halvering University as part of the university pass partnership, and university passes are valid on it.")
    return dict(section=S_NIGHT, title=rng.choice([f"{r} night bus", f"{r} night bus: {a} to {b}", f"Night route {r}"]),
                tags=f"night-bus route:{r.lower()}", body="\n\n".join(paras), updated=rand_date(rng))


# ------------------------------------------------------------------ ferry notices
FERRY_NOTICES = [
    ("Sound Ferry: reduced service on {day}", "Because of strong winds forecast for {day}, the Sound Ferry will run every hour instead of every 30 minutes. Sailings may be cancelled at short notice if conditions get worse. Replacement buses run via Tallow Bridge. Tickets for cancelled sailings are valid on the replacement buses."),
    ("Ferry refit: crossings every 40 minutes in January {year}", "One of our two ferries goes for its annual refit from {date} for three weeks. Crossings run every 40 minutes while one vessel is away. The refit includes new seating and a larger pram area on the main deck."),
    ("Ferrisham Pier gangway works", "The gangway at Ferrisham Pier is being replaced from {date}. A temporary gangway is in use; it is step-free but steeper than usual at low tide, and the crew will help anyone who needs it."),
    ("Ferry cancelled on {day}", "All Sound Ferry sailings were cancelled on {day} because of a technical fault. We are sorry for the disruption. If your journey was affected, you can claim delay compensation or a refund of your ticket."),
    ("Summer ferry timetable", "From {date}, the Sound Ferry runs every 20 minutes at peak times and the last sailing from Harbour Quay leaves at 23:30. Bikes are carried on every sailing, but spaces fill up quickly on sunny days."),
    ("Fog on the Sound: possible delays", "Fog is forecast on the Sound on {day}. Ferries may sail more slowly or wait for the fog to lift. Check the app before you travel; live ferry positions are shown on the map."),
]


def ferry_notice(rng, k):
    title_t, body_t = FERRY_NOTICES[k % len(FERRY_NOTICES)]
    d0 = rand_date(rng)
    if "January" in title_t:
        d0 = dt.date(rng.choice([2025, 2026]), 1, rng.randint(3, 12))
    slots = dict(day=fmt_day(d0), date=fmt_date(d0), year=d0.year)
    tags = "ferry-timetable ferry-general"
    if "cancel" in body_t or "wind" in body_t:
        tags = "ferry-weather ferry-timetable"
    return dict(section=S_FERRY, title=title_t.format(**slots), tags=tags,
                body=body_t.format(**slots), updated=d0 - dt.timedelta(days=rng.randint(1, 6)))
