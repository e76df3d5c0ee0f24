"""What riders search for: intents, the hand-written query list with traffic,
and which queries are judged.

An intent says which article topics answer it: (grade-3 tags, grade-2 tags,
grade-1 tags).  A tag pattern is a plain tag, "a+b" (the article has both
tags) or "prefix-*" (any tag starting with prefix-).
"""

INTENTS = {
    "timetable": (["timetable-general", "journey-planner"], ["realtime", "holiday-timetable", "ferry-timetable"], ["service-change", "timetable-route", "tram-general"]),
    "bus-timetable": (["timetable-general"], ["realtime", "journey-planner", "holiday-timetable", "timetable-route"], ["service-change"]),
    "journey-planner": (["journey-planner"], ["timetable-general", "realtime", "access-app"], ["app-basics"]),
    "realtime": (["realtime"], ["timetable-general", "app-basics"], ["journey-planner", "stop-notice"]),
    "holiday": (["holiday-timetable"], ["timetable-general"], ["event-services"]),
    "service-change": (["service-change"], ["timetable-route", "news-consultation"], ["timetable-general", "diversion"]),
    "lost-property": (["lost-property"], ["lost-property-fees", "lost-and-found"], ["card-lost", "left-luggage", "pass-replace", "luggage-unattended"]),
    "lost-and-found": (["lost-property", "lost-and-found"], ["lost-property-fees"], ["card-lost", "left-luggage"]),
    "lost-property-ferry": (["lost-property+ferry-general"], ["lost-property"], ["lost-property-fees", "ferry-general"]),
    "lost-property-hours": (["lost-property+contact-hours"], ["lost-property", "contact-hours"], ["lost-property-fees"]),
    "lost-phone": (["lost-property"], ["lost-property-fees"], ["lost-and-found"]),
    "left-luggage": (["left-luggage"], ["luggage-large"], ["luggage-onboard", "lost-property"]),
    "left-luggage-ferry": (["left-luggage+ferry-general"], ["left-luggage"], ["luggage-onboard", "ferry-general"]),
    "luggage": (["luggage-onboard", "luggage-large"], ["left-luggage"], ["luggage-unattended", "bike-onboard"]),
    "unattended": (["luggage-unattended"], ["conduct"], ["lost-property", "safety-police"]),
    "card": (["card-smart"], ["card-topup", "card-register", "card-balance", "card-lost"], ["fare-cap", "card-fault", "card-transfer", "card-visitor"]),
    "card-lost": (["card-lost"], ["pass-replace", "card-register"], ["lost-property", "card-smart"]),
    "topup": (["card-topup", "card-autoload"], ["card-smart", "card-balance"], ["ticket-machine"]),
    "balance": (["card-balance"], ["card-smart", "card-topup"], ["card-register"]),
    "card-fault": (["card-fault"], ["card-smart"], ["card-balance"]),
    "register": (["card-register"], ["card-smart", "app-account"], ["card-lost"]),
    "fares": (["fare-basics"], ["fare-zones", "fare-cap", "fare-child", "fare-price-change", "ferry-fares"], ["pass-concession", "fare-return", "fare-group"]),
    "fare-rise": (["fare-price-change"], ["fare-basics"], ["fare-transition"]),
    "zones": (["fare-zones"], ["fare-basics", "fare-transition"], ["fare-cap"]),
    "zone-transition": (["fare-transition"], ["fare-zones"], ["news-annual-report", "pass-season"]),
    "cap": (["fare-cap"], ["fare-contactless", "fare-basics"], ["card-smart"]),
    "contactless": (["fare-contactless"], ["fare-cap", "refund-overcharge"], ["fare-basics"]),
    "overcharge": (["refund-overcharge"], ["fare-contactless", "refund-process"], ["fare-cap"]),
    "buy-onboard": (["fare-buy-onboard"], ["fare-basics", "ticket-app"], ["fare-contactless"]),
    "ticket-machine": (["ticket-machine"], ["news-machines"], ["card-topup"]),
    "app-ticket": (["ticket-app"], ["app-basics", "fare-buy-onboard"], ["refund-unused"]),
    "penalty": (["fare-penalty"], [], ["fare-contactless", "conduct"]),
    "group": (["fare-group"], ["news-community", "booking-amend+fare-group"], ["pass-school"]),
    "return": (["fare-return"], ["fare-basics"], ["ferry-fares"]),
    "child": (["fare-child"], ["pass-school", "fare-basics"], ["fare-group", "pass-student"]),
    "student-pass": (["pass-student"], ["pass-overview", "pass-concession"], ["pass-university", "pass-school", "ferry-fares"]),
    "senior-pass": (["pass-senior"], ["pass-overview", "pass-concession"], ["pass-access", "pass-renew"]),
    "senior-renew": (["pass-senior+pass-renew"], ["pass-senior"], ["pass-renew"]),
    "university-pass": (["pass-university"], ["pass-overview", "news-university"], ["pass-student"]),
    "university-renew": (["pass-university+pass-renew"], ["pass-university"], ["pass-renew"]),
    "university-price": (["pass-university+fare-price-change"], ["pass-university"], ["fare-price-change"]),
    "concession": (["pass-concession"], ["pass-student", "pass-senior", "pass-access"], ["fare-child", "fare-basics"]),
    "access-pass": (["pass-access"], ["pass-companion", "pass-concession"], ["access-overview", "access-assistance"]),
    "companion": (["pass-companion"], ["pass-access"], ["access-assistance"]),
    "season": (["pass-season"], ["refund-season", "fare-transition"], ["fare-cap", "direct-debit"]),
    "pass-overview": (["pass-overview"], ["pass-student", "pass-senior", "pass-university", "pass-concession"], ["pass-season"]),
    "pass-replace": (["pass-replace"], ["card-lost", "pass-university+card-lost"], ["lost-property"]),
    "school": (["pass-school"], ["fare-child"], ["fare-group"]),
    "refund": (["refund-process", "refund-unused"], ["refund-season", "refund-card-balance", "refund-overcharge"], ["compensation-delay", "compensation-ferry"]),
    "refund-season": (["refund-season"], ["refund-process"], ["pass-season"]),
    "refund-card": (["refund-card-balance"], ["refund-process"], ["card-smart"]),
    "compensation": (["compensation-delay", "compensation-ferry"], ["delay"], ["refund-process", "ferry-weather", "complaint-early"]),
    "delay": (["delay", "compensation-delay"], ["realtime", "news-performance", "complaint-early"], ["feedback-complaint"]),
    "early": (["complaint-early"], ["feedback-complaint", "delay"], ["realtime"]),
    "complaint": (["feedback-complaint"], ["complaint-early", "general-enquiries"], ["compensation-delay"]),
    "general-enquiries": (["general-enquiries"], ["feedback-complaint", "contact-hours"], ["press", "access-assistance"]),
    "hours": (["contact-hours"], ["lost-property+contact-hours", "general-enquiries"], []),
    "press": (["press"], ["general-enquiries"], []),
    "night-bus": (["night-bus"], ["night-tram", "night-safety"], ["night-ferry"]),
    "night-tram": (["night-tram"], ["night-bus"], ["tram-general"]),
    "night-safety": (["night-safety"], ["safety-police", "night-bus"], ["cctv"]),
    "express": (["express-route"], ["express-airport"], ["luggage-onboard+express-route"]),
    "airport": (["express-airport"], ["express-route", "route:99"], ["luggage-large"]),
    "park-and-ride": (["park-and-ride"], ["pnr-terms", "pnr-access"], ["pnr-ev", "bike-parking"]),
    "pnr-brindle-fell": (["pnr-brindle-fell"], ["park-and-ride"], ["pnr-terms", "route:61", "route:90"]),
    "pnr-cawley-heath": (["pnr-cawley-heath"], ["park-and-ride"], ["pnr-terms", "route:12"]),
    "pnr-stonesend": (["pnr-stonesend"], ["park-and-ride", "stop-stonesend"], ["pnr-terms"]),
    "pnr-overnight": (["pnr-terms"], ["park-and-ride"], []),
    "ev-charging": (["pnr-ev"], ["park-and-ride", "news-electric"], ["onboard-wifi"]),
    "bike-bus": (["bike-onboard"], ["bike-folding", "bike-tram", "ebike"], ["bike-ferry", "bike-parking"]),
    "bike-tram": (["bike-tram"], ["bike-onboard", "bike-folding"], ["ebike"]),
    "bike-ferry": (["bike-ferry"], ["bike-onboard", "bike-folding"], ["ferry-general"]),
    "bike-parking": (["bike-parking"], ["left-luggage+bike-parking"], ["park-and-ride"]),
    "bike-tyre": (["bike-parking"], ["bike-onboard"], ["ebike"]),
    "escooter": (["safety-escooter"], ["ebike"], ["conduct"]),
    "pram": (["pram-onboard", "pram-tram", "pram-ferry"], ["access-priority-seat", "pram-onboard+express-route"], ["access-wheelchair", "luggage-onboard"]),
    "pram-bus": (["pram-onboard"], ["pram-tram", "pram-ferry"], ["access-priority-seat", "access-wheelchair"]),
    "pram-tram": (["pram-tram"], ["pram-onboard"], ["tram-doors", "access-step-free"]),
    "pram-ferry": (["pram-ferry"], ["pram-onboard"], ["ferry-accessibility", "ferry-boarding"]),
    "wheelchair": (["access-wheelchair", "access-ramp"], ["access-overview", "access-step-free", "access-mobility-scooter", "access-priority-seat"], ["access-lift", "access-assistance", "access-universal-design", "pass-access"]),
    "accessibility": (["access-overview"], ["access-step-free", "access-wheelchair", "access-universal-design", "access-lift", "access-assistance"], ["access-*", "pass-access", "ferry-accessibility", "pnr-access"]),
    "universal-design": (["access-universal-design"], ["access-overview", "access-step-free"], ["access-*", "news-extension", "stop-notice+access-universal-design"]),
    "step-free": (["access-step-free"], ["access-lift", "access-overview", "ferry-accessibility"], ["access-*", "pnr-access"]),
    "lift": (["access-lift"], ["access-step-free"], ["access-overview"]),
    "ramp": (["access-ramp"], ["access-wheelchair"], ["access-kerb"]),
    "kerb": (["access-kerb"], ["stop-notice+access-kerb"], ["access-step-free", "access-ramp"]),
    "hearing": (["access-hearing"], ["access-overview"], ["access-support-card"]),
    "visual": (["access-visual"], ["tram-lines", "access-app"], ["access-overview"]),
    "scooter": (["access-mobility-scooter"], ["access-wheelchair"], ["safety-escooter"]),
    "assistance": (["access-assistance", "access-support-card"], ["access-overview", "booking-amend+access-assistance"], ["pass-companion"]),
    "toilets": (["access-toilets"], ["ferry-general+access-toilets", "tram-general+access-toilets"], []),
    "dog": (["access-dog"], [], ["ferry-general"]),
    "transfer": (["transfer"], ["stop-stonesend", "fare-cap"], ["fare-contactless", "rail-replacement"]),
    "change-booking": (["booking-amend"], ["account-details", "direct-debit"], ["fare-group", "access-assistance"]),
    "amend-details": (["account-details"], ["app-account", "direct-debit"], ["card-register"]),
    "direct-debit": (["direct-debit"], ["pass-season", "account-details"], []),
    "account": (["app-account"], ["account-details"], ["card-register"]),
    "app": (["app-basics"], ["ticket-app", "app-issues", "app-account"], ["realtime", "journey-planner"]),
    "app-issues": (["app-issues"], ["app-basics"], ["app-account"]),
    "wifi": (["onboard-wifi"], ["express-route"], []),
    "diversions": (["diversion-general"], ["diversion"], ["rail-replacement", "stop-notice"]),
    "rail-replacement": (["rail-replacement"], ["tram-works"], ["diversion-general"]),
    "tram-works": (["tram-works"], ["rail-replacement"], ["diversion-general"]),
    "stop-closed": (["stop-notice"], ["diversion"], ["diversion-general"]),
    "ferry-timetable": (["ferry-timetable"], ["ferry-weather", "ferry-general"], ["ferry-fares", "night-ferry"]),
    "ferry-fares": (["ferry-fares"], ["ferry-general", "card-smart+ferry-fares"], ["ferry-timetable"]),
    "ferry-weather": (["ferry-weather"], ["ferry-timetable", "compensation-ferry"], ["ferry-general"]),
    "ferry-general": (["ferry-general", "ferry-boarding"], ["ferry-timetable"], ["ferry-fares"]),
    "tram": (["tram-general", "tram-lines"], ["news-extension", "tram-doors"], ["tram-works", "night-tram"]),
    "tram-lines": (["tram-lines"], ["tram-general"], ["tram-doors", "access-visual"]),
    "tram-doors": (["tram-doors"], ["tram-general"], ["fare-contactless"]),
    "tram-times": (["tram-general"], ["tram-lines", "timetable-general", "realtime"], ["night-tram"]),
    "police": (["safety-police"], ["night-safety", "cctv", "conduct"], ["luggage-unattended"]),
    "cctv": (["cctv"], ["safety-police"], []),
    "fall": (["safety-fall"], ["conduct"], ["feedback-complaint"]),
    "conduct": (["conduct"], ["safety-police"], ["luggage-unattended"]),
    "child-left": (["safety-child"], ["conduct"], ["lost-property"]),
    "jobs": (["news-careers"], ["news-training"], ["news-about"]),
    "parental-leave": (["news-careers"], [], ["news-training"]),
    "news": (["news-about"], ["news-*"], []),
    "organ": (["event-organ"], ["event-services"], []),
    "on-demand": (["news-experiment"], ["booking-amend+news-experiment"], []),
    "experience": (["news-experience"], ["news-annual-report"], []),
    "eoi": (["news-eoi"], ["news-community"], []),
    "events": (["event-services", "event-organ"], ["night-ferry"], ["news-stop"]),
    "little-universe": (["stop-little-universe"], ["tram-lines"], []),
    "opera-house": (["stop-opera-house"], ["tram-lines"], ["access-lift"]),
    "electric": (["news-electric"], ["news-depot"], ["pnr-ev"]),
    "privacy": (["contact-privacy"], [], ["app-account"]),
    "visitor": (["card-visitor"], ["ferry-fares", "card-smart"], []),
    "performance": (["news-performance"], ["news-annual-report"], ["delay"]),
    "consultation": (["news-consultation"], ["service-change"], []),
}

# query | count | intent | J (judged) | extra decoy words for the judged pool
HAND_QUERIES = """
timetable|9000|timetable|J|
lost property|4000|lost-property|J|lose,leave,lost
bus timetable|3300|bus-timetable|J|
journey planner|2800|journey-planner|J|
wayfare card|2600|card|J|
fares|2400|fares|J|
student pass|2100|student-pass|J|university,access
refund|1900|refund|J|compensation
ferry timetable|1800|ferry-timetable|J|
tram times|1500|tram-times|J|
senior pass|1450|senior-pass|J|access
night bus|1300|night-bus|J|
park and ride|1250|park-and-ride|J|
top up|1200|topup|J|
contactless|1100|contactless|J|
university pass|1050|university-pass|J|universal,accessible,step-free,access,universe
lost and found|900|lost-and-found|J|lose,find,finding
left luggage|850|left-luggage|J|leave,leaving,left
diversions|800|diversions|J|
season ticket|700|season|J|
live times|650|realtime||
bikes on bus|600|bike-bus|J|
wheelchair|560|wheelchair|J|
express bus|540|express|J|expression,expressions
concession fare|480|concession|J|
pram|450|pram|J|
bus times|2400|bus-timetable||
tram timetable|900|tram-times||
smart card|420|card|J|
delay compensation|420|compensation|J|refund
real time|400|realtime|J|
rail replacement|390|rail-replacement|J|train,training
general enquiries|380|general-enquiries|J|generally,generation
transfer|360|transfer|J|amend,alter,transferring
transit card|340|card|J|transition,transitional,transit
fare zones|330|zones|J|
zones|300|zones||
child fare|300|child|J|children
accessibility|290|accessibility|J|access
lifts|280|lift|J|
step free|270|step-free|J|free
ferry fares|260|ferry-fares|J|
opening hours|260|hours|J|
light rail|250|tram|J|lighting,lights,light
complaint|250|complaint|J|
penalty fare|240|penalty|J|
uni pass|220|university-pass|J|universal
bus left early|210|early|J|leave,leaving
travel card|210|card|J|travel
x40 airport|200|airport|J|
lost wayfare card|200|card-lost|J|lose,leave
stroller|180|pram|J|
student pass renewal|170|student-pass||
senior pass renewal|170|senior-renew|J|
group ticket|160|group|J|
contactless refund|160|overcharge|J|
refund season ticket|150|refund-season|J|
bike on tram|150|bike-tram|J|
ferry cancelled|150|ferry-weather|J|
change booking|140|change-booking|J|transfer,connection,chang
university pass price|140|university-price|J|universal,access
e-scooter|130|escooter|J|scooter,scooters
lost property ferry|130|lost-property-ferry|J|lose,leave
charged twice|130|overcharge||
luggage|120|luggage|J|leave
free transfer|120|transfer|J|amend,alter,free
pushchair|120|pram|J|
direct debit|120|direct-debit|J|
ticket machine|115|ticket-machine|J|
amend details|110|amend-details|J|
jobs|110|jobs|J|
police|110|police|J|policy,policies
holiday timetable|110|holiday|J|
buggy|100|pram|J|buggy
cctv|90|cctv||
dog on bus|90|dog|J|
wifi|90|wifi|J|
app not working|90|app-issues|J|
login|85|account|J|
stroller on bus|85|pram-bus|J|
change address|80|amend-details|J|
left luggage harbour quay|80|left-luggage-ferry|J|leave,left
electric buses|80|electric|J|transition
access pass|80|access-pass|J|university,universal
x3 timetable|80|express|J|
luggage storage|75|left-luggage|J|leave,storage
lost property opening hours|75|lost-property-hours|J|lose
brindle fell park and ride|75|pnr-brindle-fell|J|fell,fall,falls
companion pass|70|companion|J|
hearing loop|70|hearing|J|
bike on ferry|70|bike-ferry|J|
lost university pass|70|pass-replace|J|universal,lose
children travel free|70|child|J|child
fell on bus|65|fall|J|fall,fell
unattended bag|60|unattended|J|leave
universal design|60|universal-design|J|university,universe
mobility scooter|60|scooter|J|
connection stonesend|55|transfer|J|connect
double buggy|55|pram|J|
customer experience|55|experience|J|experiment,experiments
parental leave|50|parental-leave|J|left,leave
little universe|50|little-universe|J|university,universal
opera house|50|opera-house|J|operator,operation
on demand bus|50|on-demand|J|
change bus|50|transfer|J|amend,alter
alter direct debit|45|direct-debit|J|transfer,change
organ festival|45|organ|J|organization,organize,organized
expression of interest|40|eoi|J|express
amend booking|40|change-booking|J|transfer
raised kerb|40|kerb|J|curb
colour blind|40|visual|J|color
general inquiries|35|general-enquiries|J|generally
assistance booking|35|assistance|J|
transfer ticket|35|transfer|J|transferring,balance
zone transition|30|zone-transition|J|transit
transitions|14|zone-transition|J|transit
operator news|30|news|J|opera,operation
n4 night bus|70|night-bus|J|
route 22 diversion|45|diversions|J|
14 timetable|120|bus-timetable|J|
jobseeker|30|concession|J|
lost phone|80|lost-phone|J|lose
strollers|25|pram||
stroller tram|20|pram-tram|J|
stroller ferry|12|pram-ferry||
can i take a stroller on the bus|14|pram-bus||
folding stroller|9|pram||
uni pass renewal|30|university-renew|J|universal
uni pass cost|40|university-price||
uni bus pass|35|university-pass||
university bus pass|160|university-pass||
university pass renewal|90|university-renew|J|universal
university pass staff|40|university-pass||
university student travel|25|university-pass||
universal design standard|14|universal-design||
accessible buses|60|wheelchair||
accessible travel|55|accessibility||
step free stations|60|step-free||
step free stops|40|step-free||
step-free access|45|step-free||
disabled pass|90|access-pass||
disabled travel|45|access-pass||
wheelchair ramp|60|ramp||
wheelchair on tram|40|wheelchair||
wheelchair space|45|wheelchair||
lift out of order|60|lift||
left luggage halvering central|45|left-luggage||
left luggage prices|40|left-luggage||
left luggage lockers|50|left-luggage||
left luggage ferry|35|left-luggage-ferry||
luggage lockers|40|left-luggage||
bag storage|30|left-luggage||
luggage storage halvering|18|left-luggage||
store luggage|20|left-luggage||
suitcase on bus|45|luggage||
large luggage|30|luggage||
lost and found phone|30|lost-phone||
lost and found bus|40|lost-and-found||
lost and found tram|25|lost-and-found||
lost item|60|lost-property||
lost bag|55|lost-property||
lost keys|40|lost-phone||
lost wallet|45|lost-phone||
lost umbrella|12|lost-property||
found item|20|lost-and-found||
i left my bag on the bus|25|lost-property||
left bag on tram|18|lost-property||
left phone on bus|30|lost-phone||
lost card|150|card-lost||
lost student pass|50|pass-replace||
lost senior pass|40|pass-replace||
lost bus pass|60|pass-replace||
replacement card|50|card-lost||
transit pass|60|card||
transit card balance|25|balance||
transit card top up|20|topup||
transit|40|card||
transit police|30|police||
smart card top up|40|topup||
card balance|90|balance||
check balance|70|balance||
auto top up|60|topup||
top up online|50|topup||
register card|60|register||
card not working|60|card-fault||
card declined|40|card-fault||
travel card price|35|card||
wayfare|260|card||
wayfare app|60|app||
wayfare card refund|50|refund-card||
wayfare top up|140|topup||
corrin journeys app|70|app||
app|100|app||
app tickets|80|app-ticket||
mobile ticket|50|app-ticket||
buy ticket on bus|60|buy-onboard||
cash on bus|40|buy-onboard||
pay cash|30|buy-onboard||
ticket prices|180|fares||
bus fares|350|fares||
tram fares|140|fares||
fare increase|60|fare-rise||
fare rise|25|fare-rise||
price increase|20|fare-rise||
daily cap|70|cap||
fare cap|80|cap||
weekly cap|50|cap||
tap out|50|contactless||
forgot to tap out|45|contactless||
touch out|30|contactless||
pay with phone|40|contactless||
phone payment|25|contactless||
penalty fare appeal|50|penalty||
fine|40|penalty||
fined on tram|25|penalty||
return ticket|60|return||
day ticket|120|fares||
group travel|40|group||
family ticket|50|group||
school trip|25|group||
child ticket|60|child||
kids fare|30|child||
under 5 free|35|child||
school bus pass|50|school||
school transport|30|school||
student discount|80|student-pass||
student pass apply|70|student-pass||
student pass photo|30|student-pass||
student card|60|student-pass||
college pass|25|student-pass||
apply student pass|40|student-pass||
senior bus pass|120|senior-pass||
pensioner pass|45|senior-pass||
bus pass over 66|20|senior-pass||
free bus pass|80|senior-pass||
senior pass before 9.30|25|senior-pass||
concession|90|concession||
concession card|50|concession||
discount fares|30|concession||
carers card|20|concession||
monthly pass|90|season||
annual season ticket|50|season||
weekly ticket|60|season||
which pass|20|pass-overview||
bus pass|380|pass-overview||
passes|50|pass-overview||
refunds|150|refund||
ticket refund|60|refund||
refund app ticket|30|refund||
unused ticket refund|25|refund||
card refund|25|refund-card||
compensation|110|compensation|J|refund
delay repay|50|compensation||
late bus compensation|30|compensation||
ferry compensation|20|compensation||
bus late|90|delay|J|lately
bus delays|80|delay||
tram delays|60|delay||
bus didnt turn up|40|early||
bus didn't stop|35|early||
bus went past|25|early||
driver didnt stop|20|early||
make a complaint|70|complaint||
complaints|60|complaint||
feedback|40|complaint||
compliment driver|12|complaint||
contact|150|general-enquiries||
contact us|120|general-enquiries||
phone number|90|general-enquiries||
customer service|70|general-enquiries||
customer services phone|25|general-enquiries||
email|20|general-enquiries||
travel centre|60|hours||
travel centre opening times|35|hours||
press office|10|press||
night buses|200|night-bus||
late night bus|45|night-bus||
last bus|110|night-bus||
last tram|90|night-tram||
night tram|60|night-tram|J|
night bus fare|30|night-bus||
safe at night|15|night-safety||
express routes|60|express||
x1|40|express||
airport bus|150|airport||
bus to airport|80|airport||
airport express|45|airport||
park and ride prices|50|park-and-ride||
park and ride times|40|park-and-ride||
park-and-ride|60|park-and-ride||
park ride|40|park-and-ride||
cawley heath park and ride|45|pnr-cawley-heath||
stonesend park and ride|40|pnr-stonesend||
brindle fell|30|pnr-brindle-fell||
p1 bus|20|pnr-brindle-fell||
park and ride overnight|20|pnr-overnight||
ev charging|25|ev-charging||
electric car charging|18|ev-charging||
bikes on trams|80|bike-tram||
bike on bus|70|bike-bus||
bike rack|40|bike-bus||
bike racks on buses|20|bike-bus||
folding bike|40|bike-bus||
cycle|25|bike-bus||
bicycle|30|bike-bus||
bike parking|45|bike-parking||
bike storage|30|bike-parking||
cycle hub|25|bike-parking||
bike tyre pump|15|bike-tyre|J|tire,tired
tyre pump|12|bike-tyre||
bike tire pump|8|bike-tyre||
flat tyre|10|bike-tyre||
flat tire|6|bike-tyre||
ebike|30|bike-bus||
e-bike|25|bike-bus||
e scooter|40|escooter||
electric scooter|35|escooter||
scooter|40|escooter||
pram on bus|110|pram-bus||
pram on tram|40|pram-tram||
prams|60|pram||
pushchair on bus|60|pram-bus||
pushchairs|25|pram||
buggy on bus|30|pram-bus||
double pushchair|25|pram||
baby|15|pram||
wheelchair accessible|40|wheelchair||
ramps|20|ramp||
kerb|12|kerb||
curb|6|kerb||
hearing loop bus|10|hearing||
colour contrast|10|visual||
large print timetable|15|visual||
mobility scooter on bus|30|scooter||
travel assistance|45|assistance||
assistance|20|assistance||
travel support card|15|assistance||
toilets|60|toilets||
accessible toilet|25|toilets||
assistance dog|20|dog||
dogs|40|dog||
dog on ferry|25|dog||
change|40|transfer||
changing buses|30|transfer||
connections|35|transfer||
free change|15|transfer||
transfer bus to tram|25|transfer||
ferry connection|20|transfer||
change my booking|45|change-booking||
cancel booking|40|change-booking||
amend group booking|12|change-booking||
booking|35|change-booking||
group booking|25|change-booking||
change direct debit date|25|direct-debit||
change bank details|20|direct-debit||
update address|25|amend-details||
change name|15|amend-details||
my account|70|account||
sign in|40|account||
forgot password|45|account||
account locked|15|account||
privacy|20|privacy||
privacy policy|25|privacy||
app problems|35|app-issues||
app crash|25|app-issues||
app buggy|6|app-issues||
wifi on bus|30|wifi||
usb charging|15|wifi||
diversion|250|diversions||
road closures|120|diversions||
roadworks|110|diversions||
bus diversions|90|diversions||
route 14 diversion|40|diversions||
tram works|80|tram-works||
tram closure|50|tram-works||
replacement bus|60|rail-replacement||
rail replacement bus|40|rail-replacement||
stop closed|50|stop-closed||
bus stop moved|25|stop-closed||
service changes|120|service-change||
timetable changes|140|service-change||
new timetable|90|service-change||
consultation|15|consultation||
sunday timetable|60|holiday||
christmas timetable|80|holiday||
bank holiday buses|50|holiday||
school holidays|25|holiday||
ferry|600|ferry-timetable||
ferry times|400|ferry-timetable||
sound ferry|200|ferry-timetable||
ferry to ferrisham|90|ferry-timetable||
ferry prices|60|ferry-fares||
ferry weather|40|ferry-weather||
is the ferry running|50|ferry-weather||
ferry food|10|ferry-general||
ferry toilets|8|toilets||
ferry boarding|20|ferry-general||
tram|280|tram||
trams|90|tram||
tram map|120|tram-lines||
tram lines|50|tram-lines||
harbour line|60|tram-lines||
campus line|70|tram-lines||
valley line|50|tram-lines||
tram doors|10|tram-doors||
leave tram rear door|6|tram-doors||
tram frequency|20|tram-times||
first tram|30|tram-times||
safety|30|police||
antisocial behaviour|20|conduct||
smoking|10|conduct||
alcohol on bus|10|conduct||
food on bus|15|conduct||
injured on bus|20|fall||
fall on tram|10|fall||
slipped|6|fall||
child left on bus|8|child-left||
unattended luggage|15|unattended||
suspicious package|8|unattended||
careers|40|jobs||
bus driver jobs|60|jobs||
driver training|25|jobs||
vacancies|20|jobs||
maternity leave|10|parental-leave||
news|60|news||
about us|20|news||
annual report|15|news||
on demand|25|on-demand||
minibus linnet vale|12|on-demand||
survey|15|experience||
experiment|6|on-demand||
kiosk harbour quay|8|eoi||
bus shelter art|6|eoi||
cathedral organ|15|organ||
organ recital|8|organ||
harbour festival|60|events||
half marathon|40|events||
fireworks|30|events||
christmas market buses|20|events||
graduation|15|events||
football buses|25|events||
new year's eve|30|events||
little universe tram|12|little-universe||
science centre|15|little-universe||
opera house tram|15|opera-house||
opera house stop|12|opera-house||
electric bus|35|electric||
new depot|8|electric||
visitor card|30|visitor||
tourist ticket|25|visitor||
sound rover|20|visitor||
punctuality|10|performance||
performance|8|performance||
route consultation|8|consultation||
"""


def hand_queries():
    rows = []
    for line in HAND_QUERIES.strip().splitlines():
        q, count, intent, judged, decoys = line.split("|")
        rows.append(dict(query=q, count=int(count), intent=intent, judged=(judged == "J"),
                         decoys=[d for d in decoys.split(",") if d]))
    return rows


# Reformulation chains for sessions: each list is one rider's sequence.
# (weight, [queries...])
CHAINS = [
    (40, ["stroller", "pushchair"]),
    (25, ["stroller", "pram"]),
    (20, ["stroller", "pram", "pram on bus"]),
    (18, ["stroller on bus", "pram on bus"]),
    (12, ["stroller on bus", "pushchair on bus"]),
    (10, ["strollers", "prams"]),
    (8, ["stroller tram", "pram on tram"]),
    (5, ["stroller ferry", "pram"]),
    (6, ["can i take a stroller on the bus", "pram on bus"]),
    (6, ["folding stroller", "pushchair"]),
    (10, ["buggy", "pushchair"]),
    (8, ["buggy on bus", "pram on bus"]),
    (6, ["double buggy", "double pushchair"]),
    (5, ["bike tyre pump", "bike tire pump"]),
    (4, ["flat tyre", "flat tire"]),
    (4, ["tyre pump", "cycle hub"]),
    (30, ["left luggage", "luggage storage"]),
    (20, ["left luggage", "left luggage halvering central"]),
    (12, ["left luggage", "left luggage lockers"]),
    (10, ["luggage storage", "left luggage"]),
    (8, ["bag storage", "left luggage"]),
    (8, ["left luggage harbour quay", "left luggage ferry"]),
    (40, ["uni pass", "university pass"]),
    (12, ["uni pass cost", "university pass price"]),
    (10, ["uni bus pass", "university bus pass"]),
    (8, ["uni pass renewal", "university pass renewal"]),
    (12, ["student pass", "university pass"]),
    (25, ["transit card", "wayfare card"]),
    (12, ["transit card", "smart card"]),
    (6, ["transit card balance", "card balance"]),
    (5, ["transit pass", "wayfare card"]),
    (30, ["lost and found", "lost property"]),
    (20, ["lost property", "lost property ferry"]),
    (10, ["lost property", "lost property opening hours"]),
    (10, ["lost phone", "lost property"]),
    (8, ["lost and found phone", "lost phone"]),
    (8, ["i left my bag on the bus", "lost property"]),
    (15, ["refund", "delay compensation"]),
    (10, ["compensation", "delay compensation"]),
    (8, ["delay repay", "delay compensation"]),
    (10, ["general inquiries", "general enquiries"]),
    (8, ["general enquiries", "contact us"]),
    (12, ["change booking", "amend booking"]),
    (8, ["change my booking", "cancel booking"]),
    (6, ["amend booking", "amend group booking"]),
    (8, ["change bus", "free transfer"]),
    (6, ["transfer", "free transfer"]),
    (6, ["change direct debit date", "alter direct debit"]),
    (15, ["wheelchair", "wheelchair ramp"]),
    (8, ["universal design", "accessibility"]),
    (6, ["universal design", "universal design standard"]),
    (10, ["accessibility", "step free"]),
    (8, ["step free", "lifts"]),
    (12, ["express bus", "x3 timetable"]),
    (8, ["express bus", "x40 airport"]),
    (12, ["night bus", "n4 night bus"]),
    (8, ["last bus", "night bus"]),
    (12, ["park and ride", "brindle fell park and ride"]),
    (8, ["park and ride", "cawley heath park and ride"]),
    (15, ["senior pass", "senior pass renewal"]),
    (10, ["bus pass", "senior bus pass"]),
    (10, ["bus pass", "student pass"]),
    (20, ["timetable", "bus timetable"]),
    (15, ["timetable", "14 timetable"]),
    (12, ["bus times", "live times"]),
    (10, ["timetable", "journey planner"]),
    (10, ["ferry", "ferry timetable"]),
    (8, ["ferry timetable", "is the ferry running"]),
    (8, ["ferry cancelled", "ferry compensation"]),
    (10, ["tram times", "tram map"]),
    (6, ["light rail", "tram map"]),
    (8, ["transitions", "zone transition"]),
    (6, ["zones", "fare zones"]),
    (8, ["fares", "bus fares"]),
    (8, ["fares", "day ticket"]),
    (8, ["contactless", "daily cap"]),
    (6, ["charged twice", "contactless refund"]),
    (8, ["top up", "auto top up"]),
    (6, ["wayfare card", "register card"]),
    (8, ["lost wayfare card", "replacement card"]),
    (6, ["app not working", "app problems"]),
    (6, ["login", "forgot password"]),
    (6, ["diversions", "route 22 diversion"]),
    (6, ["rail replacement", "tram works"]),
    (6, ["bikes on bus", "bike on tram"]),
    (4, ["e-scooter", "e scooter"]),
    (6, ["jobs", "bus driver jobs"]),
    (4, ["parental leave", "careers"]),
    (4, ["police", "transit police"]),
    (4, ["little universe", "little universe tram"]),
    (4, ["opera house", "opera house tram"]),
    (3, ["organ festival", "cathedral organ"]),
    (3, ["expression of interest", "kiosk harbour quay"]),
    (5, ["bus left early", "make a complaint"]),
    (5, ["bus late", "delay compensation"]),
]
