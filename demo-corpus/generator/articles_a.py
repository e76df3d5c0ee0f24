"""Hand-written help-centre articles, part A.

Every entry is (section, title, tags, body).  `tags` is a space-separated
list of internal topic labels: the first is the article's main topic, the
rest are secondary.  Tags never reach the output; the generator uses them
to decide clicks and relevance grades.  Paragraphs in `body` are separated
by a blank line.
"""

S_FARES = "Fares and tickets"
S_PASSES = "Passes and concessions"
S_CARD = "Wayfare card and app"
S_TIMES = "Timetables and service changes"
S_WORKS = "Works and diversions"
S_ACCESS = "Accessibility"
S_BIKES = "Bikes, prams and luggage"
S_LOST = "Lost property and left luggage"
S_REFUNDS = "Refunds and compensation"
S_NIGHT = "Night services"
S_EXPRESS = "Express routes"
S_PNR = "Park and ride"
S_FERRY = "Ferry"
S_TRAMS = "Trams"
S_SAFETY = "Safety and conduct"
S_NEWS = "Operator news"
S_CONTACT = "Contact us"

ARTICLES_A = [
# ---------------------------------------------------------------- lost property
(S_LOST, "Lost property: reporting and collecting items", "lost-property", """
Lost something on a bus, tram or the Sound Ferry? Our lost property department at the Halvering Central Travel Centre receives everything that is found on our vehicles, at tram stops and at the ferry terminals.

Items found on buses are handed in at the depot at the end of the driver's shift and usually reach the lost property office within two working days. Items found on trams and at tram stops arrive the next morning. Anything found on the ferry is kept at Harbour Quay for three days before it is sent on to Halvering Central.

To report a lost item, fill in the lost property form in the Corrin Journeys app or on this site. Tell us the route, the direction of travel, the approximate time and a short description, such as the colour, the brand and anything written on it. We compare new reports with the items that come in every day and contact you by email or text if we find a match.

Please do not phone the depots. Depot staff cannot search for items, and it only slows down the process for everyone.
"""),
(S_LOST, "How long do you keep lost property?", "lost-property-fees lost-property", """
We keep most lost property for 28 days from the day it was found. Phones, wallets, keys, passports and bags that contain personal identification are held for 60 days. Food, drink and anything damp or perishable is not kept. After the holding period, unclaimed items are donated to local charities or securely destroyed, and cards are returned to the bank that issued them.
"""),
(S_LOST, "Lost property charges and postage", "lost-property-fees", """
Collecting an item from the lost property office is free.

If you cannot come to Halvering Central, we can post small items to any address in the country for £5, or £9 for tracked delivery. Larger items can be sent by courier at cost. You pay when you confirm the match, by card over the phone or online.

Keys, bank cards and medication can only be collected in person, with photo ID.
"""),
(S_LOST, "Lost property from the Sound Ferry", "lost-property ferry-general", """
If you left something on the Sound Ferry or in the waiting rooms at Harbour Quay or Ferrisham Pier, ask the crew or the terminal staff as soon as you can. Many items are found within minutes of the crossing and can be handed back straight away.

Items that are not claimed on the day are kept in the Harbour Quay office for three days and then moved to the lost property department at Halvering Central. Report the loss with the online form and select "Sound Ferry" as the service. Tell us the sailing time and which deck you were on.
"""),
(S_LOST, "I left something on a tram", "lost-property tram-general", """
If you left an item on a tram, speak to a customer host at the next staffed stop, or call the tram control room on the number shown inside every tram. The control room can ask the driver to look at the end of the line.

If the item is not found the same day, use the lost property form. Items found on trams reach the lost property office the following morning.
"""),
(S_LOST, "Found something on a bus or tram?", "lost-and-found lost-property", """
Thank you for handing it in. If you find an item on one of our vehicles, give it to the driver, the crew or a customer host. Please do not leave it on the seat or take it home to hand in later, because the owner may already be looking for it.

If you found something at a bus stop or tram stop after the vehicle has gone, you can take it to any travel centre. Staff will log it so that the owner can find it through the lost property service.
"""),
(S_LOST, "Lost property office opening hours", "lost-property contact-hours", """
The lost property office at Halvering Central Travel Centre is open from 08:00 to 18:00 Monday to Friday and 09:00 to 16:00 on Saturdays. It is closed on Sundays and public holidays. The office is on the upper concourse, by the lifts.
"""),
(S_LOST, "Left luggage at Halvering Central", "left-luggage", """
The left luggage office at Halvering Central is on the lower concourse, next to the tram platforms. You can store suitcases, bags, pushchairs and sports equipment for up to seven days.

Prices are £4 per item for up to four hours and £7 per item for up to 24 hours. Oversized items such as bikes, surfboards and musical instruments cost £10 per day. You can pay by card, by contactless or with your Wayfare card.

The office is open from 06:30 to 22:00 Monday to Saturday and from 08:00 to 20:00 on Sundays. Items still in left luggage seven days after the paid period ends are moved to lost property.

For security reasons every item is scanned, and we cannot accept liquids in open containers, gas canisters or anything that is alive.
"""),
(S_LOST, "Left luggage lockers at Harbour Quay ferry terminal", "left-luggage ferry-general", """
There are 60 self-service left luggage lockers in the Harbour Quay ferry terminal, beside the ticket office. Small lockers cost £3 for four hours and large lockers £5. The maximum stay is 48 hours.

Pay at the locker with contactless or your Wayfare card. The locker prints a receipt with a six-digit code. Keep it safe: you need the code to open the locker again. If you lose the code, terminal staff can open the locker once they have checked your ID.
"""),
(S_LOST, "Is there left luggage at Ferrisham Pier?", "left-luggage ferry-general", """
Ferrisham Pier does not have a staffed left luggage office, but there are 24 lockers in the waiting room, open from the first sailing to the last. They take bags up to the size of a large cabin case and accept contactless payments only.
"""),
(S_LOST, "Left luggage and bike storage for day visitors", "left-luggage bike-parking", """
Visiting Halvering for the day? You can store a bike in the secure cycle hub at Halvering Central and bags in the left luggage office on the lower concourse. Both are a short walk from the ferry and the tram.

The cycle hub costs £1.50 per day with a Wayfare card and has a free tyre pump and basic tools. Left luggage costs from £4 per item.
"""),
(S_LOST, "Lost or stolen Wayfare card", "card-lost card-smart", """
If you lose your Wayfare card or it is stolen, report it straight away in your online account or by calling general enquiries. We block the card within an hour so that nobody else can use it.

If your card is registered, you will not lose your balance or any passes on it. We move everything to a replacement card, which costs £3 and arrives within five working days. Pay-as-you-go journeys made after you report the card as lost are refunded.

If your card was not registered, we cannot tell it apart from other cards, so we cannot block it or move the balance. This is why we recommend registering every card.
"""),
(S_LOST, "What happens to unclaimed lost property?", "lost-property", """
Items that are not claimed by the end of the holding period are sorted once a month. Clothes, umbrellas, books and toys go to charity shops in Halvering and Ferrisham. Phones and laptops are wiped by a certified company and recycled. We never sell lost property, and we do not keep any money from it.
"""),
(S_LOST, "Checking on a lost property report", "lost-property", """
You can see the status of your report in the Corrin Journeys app under Account > Lost property. If we have found a possible match, the report says "Possible match: please confirm" and shows a photo. Reports stay open for 28 days. If you have not heard from us by then, the item has not been handed in.
"""),

# ---------------------------------------------------------------- accessibility
(S_ACCESS, "Accessible travel: a guide to our network", "access-overview access-step-free access-wheelchair", """
We want everyone to be able to travel with us confidently. This guide brings together the main things to know about accessible travel on our buses, trams and the Sound Ferry.

Every bus in our fleet is low-floor and has a powered or manual ramp, a wheelchair space and a priority area for people who find standing difficult. All trams are level-boarding at the platform, and 41 of our 46 tram stops are step-free from the street, either by ramp or by lift. The Sound Ferry has a lift between decks and step-free gangways at both terminals.

New stops, vehicles and buildings are designed to our universal design standard, which means they should work well for as many people as possible without special adaptation: clear colour contrast, tactile paving, raised kerbs, audio and visual announcements, and seating at regular intervals.

If you need help on a journey, you can book travel assistance up to two hours ahead, or simply ask the driver or a customer host. The Access pass gives free travel to eligible disabled residents, and the Companion pass lets a carer travel with you for free.

We know we still have work to do. Five tram stops still have steps, and some older bus stops do not yet have raised kerbs. Our stop improvement programme lists the dates for each one.
"""),
(S_ACCESS, "Our universal design standard", "access-universal-design access-overview", """
Universal design means designing places and services so that they work for everyone, whatever their age, size or ability, without the need for a separate "accessible version". Since 2023, every new stop, vehicle, ticket machine and web page that we commission must meet our universal design standard.

The standard has seven parts: step-free routes, clear sightlines, strong colour contrast, information in more than one format (audio, visual and tactile), seating and rest points, controls that can be reached from a seated position, and spaces that are easy to understand for people with learning disabilities or dementia.

We developed the standard with the Corrin Sound Disability Forum, and we review it every two years. You can download the full document as a PDF or request it in large print, Braille or easy read.
"""),
(S_ACCESS, "Universal design at the new Harbour Quay interchange", "access-universal-design stop-harbour-quay", """
The rebuilt Harbour Quay interchange is our first major project designed from the start to our universal design standard.

Bus stands, tram platforms and the ferry terminal are linked by a single level walkway with no steps, gates or sudden changes of surface. Every stand has a raised kerb, a shelter with seating and a real-time screen with an audio button. The walkway has a contrasting strip along its edge so that people with low vision can follow it, and the lifts to the ferry deck are large enough for two wheelchairs.

Feedback from the opening month has been positive, and we have already made two small changes that riders suggested: more handrails at the ferry ramp and brighter lighting in the subway.
"""),
(S_ACCESS, "Universal design in our new buses", "access-universal-design access-wheelchair", """
The 64 new buses arriving this year follow our universal design standard. They have a wider door with a powered ramp, two wheelchair spaces instead of one, a separate area for prams, next-stop screens visible from every seat, and a hearing loop. Bell pushes are in a contrasting colour and are placed at a height that can be reached from a wheelchair.
"""),
(S_ACCESS, "Wheelchair users on our buses", "access-wheelchair access-ramp", """
All our buses can carry a wheelchair user. When the bus arrives, the driver lowers the ramp at the front door. Once on board, reverse into the wheelchair space with your back against the backrest and apply your brakes.

The wheelchair space has priority over prams and pushchairs. If the space is occupied by a pram, the driver will ask the parent to fold it or move it, but cannot force them to leave the bus. If it is not possible to make room, the driver will call for the next bus to hold the space for you.

When you are ready to get off, press the blue button by the wheelchair space so that the driver knows to lower the ramp. Most wheelchairs and many mobility scooters fit our ramps; see our page on mobility scooters for the size limits.
"""),
(S_ACCESS, "Travelling by tram with a wheelchair", "access-wheelchair tram-general", """
Trams stop level with the platform, so you can roll straight on through any door marked with the wheelchair symbol. The wheelchair spaces are in the middle carriage, next to the help point. There is a small gap between the tram and the platform, no wider than 75 mm at any of our stops.

To leave the tram, press the door button early, as doors at busy stops close after 20 seconds. If you need more time, use the help point to speak to the driver.
"""),
(S_ACCESS, "Lifts at tram stops and stations", "access-lift access-step-free", """
Eleven tram stops and all three interchanges have lifts. We check every lift each morning, and the status of each lift is shown in the Corrin Journeys app and on the real-time screens at the stop.

If a lift is out of order, the app suggests a step-free alternative route, and customer hosts can arrange a free taxi to the nearest step-free stop. Tell us about a faulty lift by using the help point inside the lift or by calling general enquiries.

Lift outages this month: Opera House (platform 2, repairs to the door sensor, back in service by the end of the week).
"""),
(S_ACCESS, "Step-free stops and stations", "access-step-free access-lift", """
A stop is step-free when you can get from the street to the vehicle without using stairs or escalators, by level path, ramp or lift.

All bus stops are step-free by nature, although some older stops do not yet have raised kerbs. On the tram network, 41 of 46 stops are step-free. The five that are not are Ropewalk (southbound), Chandlers Walk, Tanners Hill, Old Foundry and Weavers Way. Step-free works at Ropewalk start next spring.

The step-free map shows every stop and the route to it. It is available in the app, as a PDF and in large print at travel centres.
"""),
(S_ACCESS, "Step-free access to the Sound Ferry", "ferry-accessibility access-step-free", """
Both ferry terminals are step-free. At Harbour Quay, use the lift from the interchange walkway to the boarding hall. At Ferrisham Pier, the gangway slopes gently and has a handrail on both sides.

On board, the main deck has wheelchair spaces, an accessible toilet and a lift to the upper lounge. At very low tides the gangway can be steeper than usual; the crew will always help you on and off.
"""),
(S_ACCESS, "Access pass: free travel for disabled residents", "pass-access pass-concession", """
The Access pass gives free travel on our buses, trams and the Sound Ferry to residents of the Corrin Sound area who have an eligible disability. It is valid at any time of day, seven days a week.

You can apply if you receive a qualifying disability benefit, have a visual impairment, are profoundly deaf, have a learning disability, or have been refused a driving licence on medical grounds. Apply online with proof of address and evidence of eligibility, and we will post your pass within ten working days.

The Access pass is a Wayfare card with your photo on it. Touch it on the reader as you board, just as you would any other card. If you also need someone to travel with you, ask about the Companion pass.
"""),
(S_ACCESS, "Companion pass: travelling with a carer", "pass-companion pass-access", """
If you hold an Access pass and cannot travel alone, you can ask for a Companion pass. It allows one person to travel with you for free, on any of our services. The companion does not need to be the same person every time. Apply on the same form as the Access pass, with a short letter from your GP or social worker.
"""),
(S_ACCESS, "Hearing loops and audio announcements", "access-hearing", """
Every tram and every bus built after 2015 has an induction loop, marked with the ear symbol, and all travel centres have a loop at the counter. Trams and buses announce the next stop by audio and on screen. If the announcement is not working, please tell the driver or report it so that we can fix it quickly.
"""),
(S_ACCESS, "Colour contrast, signs and maps", "access-visual", """
Our signs and maps use high colour contrast and large, clear lettering. Each tram line has its own colour (blue for the Harbour Line, green for the Campus Line and amber for the Valley Line), and we always show the line name next to the colour, so that riders with colour blindness can tell them apart.

In the Corrin Journeys app you can switch to a high-contrast color theme, increase the text size and turn on screen-reader labels. Printed timetables are available in large print on request.
"""),
(S_ACCESS, "Raised kerbs at bus stops", "access-kerb access-step-free", """
A raised kerb brings the pavement closer to the height of the bus floor, so the ramp is less steep and many people can step on without it. So far we have raised the kerb at 612 of our 1,180 bus stops, and every stop on a road that is being resurfaced gets a new kerb as part of the works.

If a car is parked at the stop, the driver may not be able to pull in close to the kerb. Please report stops where this happens often, so that we can ask the council for enforcement.
"""),
(S_ACCESS, "Assistance dogs on our services", "access-dog", """
Assistance dogs are always welcome on our buses, trams and the ferry, free of charge, including on the busiest services. Dogs should stay on the floor and on a lead. Pet dogs are also welcome but the driver can refuse a dog that is not under control.
"""),
(S_ACCESS, "Priority seats and the priority space", "access-priority-seat access-wheelchair", """
Seats near the front of buses and by the doors on trams are priority seats for older people, pregnant riders, people with disabilities and anyone who finds standing difficult. If you are sitting in a priority seat and someone needs it more than you do, please offer it.

Please leave the priority space free for wheelchair users. If you have a pram or luggage in the space and a wheelchair user boards, you will be asked to fold the pram or move the luggage.
"""),
(S_ACCESS, "Mobility scooters on buses and trams", "access-mobility-scooter access-wheelchair", """
Class 2 mobility scooters can travel on our buses and trams if they are no longer than 1,000 mm and no wider than 600 mm, have a turning circle of 1,200 mm or less, and weigh no more than 150 kg with the rider. You need a free scooter permit, which shows that you have practised boarding with one of our travel trainers. If you have already ridden with a scooter permit from another operator, you can swap it for ours. Book a practice session at any travel centre.

Class 3 scooters (the road-going kind) are too large for our vehicles.
"""),
(S_ACCESS, "Booking travel assistance", "access-assistance", """
Travel assistance is free. You can book it up to two hours before your journey in the app, online or by phone. Tell us where you are starting and finishing and what help you need: meeting you at the stop, help boarding, help with a change between tram and bus, or guiding to the ferry.

You do not have to book. You can always ask the driver, crew or a customer host, but booking means that staff are ready for you.
"""),
(S_ACCESS, "Planning an accessible journey in the app", "access-app app-basics", """
Under Settings > Accessibility in the Corrin Journeys app you can choose to see only step-free routes, avoid stops where a lift is out of order, and allow extra time for changes. The app marks each stop with its step-free status and the nearest accessible toilet.

Routes with a step-free change are shown first. If no step-free route exists, the app explains why and offers to call a customer host.
"""),
(S_ACCESS, "Travel support card", "access-support-card access-assistance", """
The travel support card is a free card you can show to staff to let them know you may need a little extra help or time, without having to explain. You can write what helps you on the back, for example "please speak slowly" or "I may need help finding the right stop". Pick one up at any travel centre or order it online.
"""),
(S_ACCESS, "Accessible toilets on our network", "access-toilets", """
Accessible toilets are available at Halvering Central, Harbour Quay, Ferrisham Pier and Stonesend Interchange, and on board the Sound Ferry. The toilets at Halvering Central include a changing place with a hoist and an adult-sized changing bench. All accessible toilets open with a standard national key, or ask staff for help.
"""),
(S_ACCESS, "Accessibility at park and ride sites", "pnr-access park-and-ride access-step-free", """
All three park and ride sites have disabled parking bays close to the bus shelter, a step-free path to the stop and a heated waiting room with a hearing loop. Blue badge holders park free of charge. The P1 and P2 buses are low-floor with a ramp.
"""),

# ---------------------------------------------------------------- passes
(S_PASSES, "University pass: discounted travel for Halvering University", "pass-university", """
The university pass gives students and staff of Halvering University unlimited travel on all our buses, trams and the Sound Ferry for a fixed price per term or per year.

It is a Wayfare card with the university logo and your photo. The pass is valid from the first day of the autumn term until the last day of the summer term, with extra weeks at each end for moving in and out.

Prices for the current academic year are £165 per term or £420 for the year for students, and £560 for the year for staff. Staff can pay monthly through the university payroll.

The university pass replaces the old campus shuttle ticket. The Campus Line tram runs every six minutes between Halvering Central and University Campus during term. During freshers' week the Campus Line kiosk is in operation from 07:30.
"""),
(S_PASSES, "How to apply for a university pass", "pass-university", """
Students apply for a university pass through the university student portal, under "Travel". You will need your student number, a passport-style photo and a payment card. Staff apply through the staff intranet.

Passes ordered before 1 September are posted to your term-time address before term starts. After that, allow five working days, or collect your pass from the Campus Line kiosk at University Campus tram stop, open on weekdays from 08:00 to 17:00 during the first four weeks of term.
"""),
(S_PASSES, "Renewing your university pass", "pass-university pass-renew", """
University passes do not renew automatically. We email you in July with a link to renew for the next academic year. If you renew before 15 August, your existing card is simply updated with the new dates and you do not need a new photo. Part-time students can renew per term.
"""),
(S_PASSES, "University pass prices", "pass-university fare-price-change", """
University pass prices for the academic year 2025/26:

Students: £165 per term, or £420 for the full year (a saving of £75).
Postgraduate researchers: £420 for the year, including the summer vacation.
Staff: £560 for the year, or £48.50 a month through payroll.

Prices are set jointly with Halvering University each spring. Students who receive the university's hardship grant can get the pass for half price; ask the student support office.
"""),
(S_PASSES, "Lost or damaged university pass", "pass-university card-lost", """
If you lose your university pass, report it in the student portal or at the Campus Line kiosk. We block the old card and send you a replacement with the same expiry date for £10. Damaged passes are replaced free of charge if you return the damaged card.
"""),
(S_PASSES, "Student pass for ages 16 to 21", "pass-student", """
The student pass gives half-price travel on buses, trams and the ferry to anyone aged 16 to 21 who is in full-time education at a school or college in the Corrin Sound area. It is valid at all times, including weekends and holidays.

The pass costs £15 a year and is loaded onto a Wayfare card with your photo. With it, single fares, day tickets and weekly tickets cost half the adult price. Students at Halvering University should use the university pass instead, which is better value for daily travel.
"""),
(S_PASSES, "Applying for a student pass", "pass-student", """
Apply for a student pass online. You need a recent photo, proof of age and a letter or email from your school or college that confirms your course. If you are under 18, a parent or carer must confirm the application.

Most applications are approved within three working days, and the card arrives by post within a week. While you wait, you can show the approval email to the driver for up to 14 days.
"""),
(S_PASSES, "Student pass photo requirements", "pass-student", """
Your photo must be a recent, clear colour image of your face, looking straight at the camera, with a plain light background. No sunglasses, hats or filters. Photos taken on a phone are fine if they meet these rules. If your photo is rejected, we email you and you can upload a new one without starting again.
"""),
(S_PASSES, "Does my student pass work in the holidays?", "pass-student", """
Yes. The student pass is valid all year until the expiry date printed on it, including school and college holidays.
"""),
(S_PASSES, "Senior pass: free off-peak travel from age 66", "pass-senior", """
If you live in the Corrin Sound area and you are 66 or over, you can get a free senior pass. It gives free travel on our buses, trams and the Sound Ferry from 09:30 to 23:00 on weekdays and all day at weekends and on public holidays.

Before 09:30 on weekdays, senior pass holders pay the concession fare, which is half the adult fare. The pass lasts five years and is renewed free of charge.
"""),
(S_PASSES, "Applying for or renewing a senior pass", "pass-senior pass-renew", """
Apply for a senior pass online, by post or at any travel centre. You need proof of age (a passport, driving licence or birth certificate) and proof of address from the last three months, plus a photo.

Senior passes last five years. We write to you two months before your pass expires with a renewal form. Renewal is free, and if your details have not changed you only need a new photo.
"""),
(S_PASSES, "Can I use my senior pass before 09:30?", "pass-senior pass-concession", """
On weekdays before 09:30, show your senior pass and pay the concession fare, which is half the adult single fare. At weekends and on public holidays your pass is valid all day.
"""),
(S_PASSES, "Concession fares explained", "pass-concession fare-basics", """
A concession fare is a reduced fare, usually half the adult price, for riders who qualify for one of our concession schemes. You pay a concession fare if you hold a student pass, a jobseeker discount card, a carer's card, or a senior pass before 09:30 on weekdays.

Concession fares apply to single tickets, day tickets and weekly caps on pay as you go. They do not apply to group tickets or to special event fares. Children aged 5 to 15 pay the child fare, which is lower again.
"""),
(S_PASSES, "Who can get a concession fare?", "pass-concession", """
You can get a concession fare if you are aged 16 to 21 and in full-time education (student pass), if you receive jobseeker's support (jobseeker discount card), if you are a registered carer (carer's card) or if you are 66 or over and travelling before 09:30 (senior pass). Disabled residents who qualify for the Access pass travel free instead.
"""),
(S_PASSES, "Jobseeker discount card", "pass-concession", """
If you are looking for work and receive jobseeker's support, the jobseeker discount card gives you concession fares for up to six months. Ask your work coach for a referral letter and bring it to any travel centre. The card can be renewed once, and we can also give you a free day ticket for a job interview: show the interview invitation to the driver.
"""),
(S_PASSES, "Child fares and travelling with children", "fare-child", """
Children under 5 travel free with a paying adult, up to four children per adult. Children aged 5 to 15 pay the child fare, which is about a third of the adult fare. From 16, young people pay the adult fare unless they have a student pass.

Children aged 11 and over may be asked for proof of age. A young person's Wayfare card, which is free, shows the date of birth and saves you from carrying ID.

Children under 8 must travel with someone aged 14 or over. On the ferry, children must stay with their adult at all times.
"""),
(S_PASSES, "Season tickets: weekly, monthly and annual", "pass-season", """
A season ticket gives you unlimited travel within the zones you choose for a week, a month or a year. It is loaded onto your Wayfare card and starts on the day you choose.

An annual season ticket costs the same as ten monthly season tickets, and you can pay for it in one go or by monthly direct debit. Season tickets can be used on buses, trams and the ferry; the all-zone season ticket also covers express routes and night buses.

If you stop needing your season ticket, you can get a refund for the unused weeks, minus a £10 admin fee.
"""),
(S_PASSES, "Annual season ticket by direct debit", "pass-season direct-debit", """
You can spread the cost of an annual season ticket over twelve monthly direct debit payments at no extra cost. Set it up in your online account. The first payment is taken before the ticket starts, and the ticket is renewed automatically each year unless you cancel it.
"""),
(S_PASSES, "Which pass is right for me?", "pass-overview pass-student pass-senior pass-university", """
We offer several passes and discounts. Here is a quick guide.

If you study or work at Halvering University, the university pass is almost always the best value. If you are 16 to 21 and at school or college, get a student pass for half-price fares. If you are 66 or over, the senior pass gives free off-peak travel. If you have a disability, check whether you qualify for the Access pass. Children under 5 travel free, and children aged 5 to 15 pay the child fare.

If you travel to work most days, a season ticket is likely to save money compared with paying for each journey. If you travel less often, pay as you go with contactless or a Wayfare card and let the daily and weekly caps do the work.
"""),
(S_PASSES, "Replacing a lost or damaged pass", "pass-replace card-lost", """
Lost passes can be replaced for £10, or £3 if the pass is a registered Wayfare card with only pay-as-you-go credit. Report the loss in your online account, and we will block the old pass and send a new one. Senior passes and Access passes are replaced free of charge once a year.
"""),
(S_PASSES, "Passes for school travel", "pass-school fare-child", """
Pupils who live more than three miles from their nearest suitable school may be entitled to a free school travel pass from the council. Apply through the council's school admissions team, not through us. If your child is not entitled, a child season ticket covers the school run and weekend journeys too.
"""),
(S_PASSES, "Using your pass on the Sound Ferry", "ferry-fares pass-senior pass-student", """
Senior passes, Access passes, university passes and student passes are all valid on the Sound Ferry. Touch your pass on the reader at the gate at Harbour Quay or Ferrisham Pier. Season tickets are valid on the ferry if they include zone 2.
"""),
]
