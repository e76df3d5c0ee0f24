"""Hand-written help-centre articles, part D (safety, news, contact, short
answers)."""

from articles_a import (S_SAFETY, S_NEWS, S_CONTACT, S_FARES, S_BIKES,
                        S_ACCESS, S_TRAMS, S_FERRY, S_TIMES, S_CARD, S_PNR,
                        S_LOST, S_NIGHT, S_PASSES, S_REFUNDS, S_EXPRESS)

ARTICLES_D = [
# ---------------------------------------------------------------- safety
(S_SAFETY, "Conditions of carriage", "conduct fare-basics luggage-onboard", """
These conditions of carriage apply to everyone who travels on buses, trams and ferries operated by Corrin Sound Transit. By travelling with us you agree to them. They are a summary; the full legal text is available on request.

1. Tickets. You must have a valid ticket or pass for the whole of your journey, or touch in with contactless or a Wayfare card. On trams and the ferry you must touch in before boarding and touch out when you leave. Staff may ask to see your ticket at any time.

2. Passes and concessions. Photo passes may only be used by the holder. Concession fares require a valid pass. Children under 5 travel free with a paying adult; children aged 5 to 15 pay the child fare.

3. Behaviour. Please respect other riders and our staff. We do not tolerate abuse, threats or violence, and we will support staff who report them to the police. Do not smoke or vape on our vehicles, at tram stops or in ferry terminals. Do not drink alcohol on board.

4. Luggage and items. You may bring luggage that you can carry yourself. Do not leave luggage unattended: bags left alone may be removed and destroyed by the emergency services. Items found on our vehicles are handed to lost property. We are not liable for loss of or damage to items unless it was caused by our negligence.

5. Bikes, prams and animals. Bikes may be carried where space allows, as set out on our bikes page. Prams and pushchairs are welcome, but the wheelchair space has priority. Assistance dogs travel free; other animals are carried at the driver's discretion.

6. Safety. Hold on while the vehicle is moving and use the handrails. If you fall or are injured on board, tell the driver or crew straight away. Follow instructions from staff in an emergency.

7. Delays and changes. We do our best to run to the timetable, but we do not guarantee connections. Our delay compensation scheme sets out what you can claim if your service runs late.

8. Refusing travel. Staff may refuse travel to anyone who is behaving in a way that is likely to put others at risk, or who refuses to pay a fare.
"""),
(S_SAFETY, "Unattended bags and suspicious items", "luggage-unattended conduct", """
Please do not leave luggage unattended anywhere on our network. If you see an unattended bag, do not touch it. Tell the driver, crew or a customer host, or use a help point.

Staff follow a simple check: is the item hidden, obviously suspicious or typical of something left by mistake? Most items turn out to be lost property and are handed in. Items that cannot be explained may lead to a stop or a vehicle being cleared while the police check them, which can delay services for everyone.
"""),
(S_SAFETY, "Transit safety officers and the police", "safety-police night-safety", """
Our transit safety officers patrol buses, trams and stops across the network, especially in the evening. They are trained in first aid and conflict management, can check tickets, and work closely with the police. Officers wear body cameras, and footage is kept for 31 days unless it is needed as evidence.

If you need the police in an emergency, call 999. For anything else, text our safety team on 61016.
"""),
(S_SAFETY, "CCTV on our vehicles", "cctv safety-police", """
Every bus, tram and ferry has CCTV, and so do the main stops and the travel centres. Recordings are kept for 31 days and are shared only with the police or when the law requires it. If you need footage for an insurance claim, ask within 21 days.
"""),
(S_SAFETY, "If you fall or are injured on board", "safety-fall conduct", """
If you fell or were hurt on one of our vehicles or at a stop, tell the driver or crew straight away so that they can help you and record the incident. If you did not report it at the time, contact us within seven days with the date, the time, the route and what happened.

Most falls happen when a vehicle brakes or moves off. Please hold a handrail, stay seated until the bus stops if you can, and keep children and bags close.
"""),
(S_SAFETY, "Alcohol, food and drink on board", "conduct", """
Cold food and drinks in closed containers are fine on all our services. Hot food is not allowed on buses and trams, and alcohol may not be drunk on board. On the ferry, drinks from the kiosk can be taken on deck.
"""),
(S_SAFETY, "Reporting antisocial behaviour", "conduct safety-police", """
If someone is behaving in a way that makes you feel unsafe, tell the driver, use the help point or text 61016. Give the route, the vehicle number (above the doors) and a description. Reports are confidential. We use them to decide where our transit safety officers patrol.
"""),
(S_SAFETY, "Our e-scooter policy", "safety-escooter", """
Since 2024 our policy has been that e-scooters, including folded ones, are not allowed on board or in stations. This follows several battery fires on other networks. E-bikes and mobility scooters are not affected by this policy.
"""),
(S_SAFETY, "Smoking and vaping", "conduct", """
Smoking and vaping are not allowed on our vehicles, in ferry terminals, under tram stop shelters or in the enclosed areas of interchanges.
"""),

# ---------------------------------------------------------------- operator news
(S_NEWS, "About Corrin Sound Transit", "news-about", """
Corrin Sound Transit is the public transport operator for Halvering and the Corrin Sound area. We operate 84 bus routes, three tram lines and the Sound Ferry, and carry about 62 million journeys a year.

We are owned by the Corrin Sound Transport Authority, which sets fares and service levels and funds the routes that are not commercial. Our operations centre at Pellow controls the whole network around the clock.

We employ 2,400 people, including 1,300 bus drivers, 210 tram drivers and 60 ferry crew.
"""),
(S_NEWS, "Expressions of interest: kiosks at Harbour Quay", "news-eoi stop-harbour-quay", """
We invite expressions of interest from local businesses to run two food and drink kiosks in the new Harbour Quay interchange. The kiosks will serve bus, tram and ferry passengers from 06:00 to 22:00.

Expressions of interest should include a short description of your business, the menu you propose and your experience of running a similar outlet. Please send expressions of interest by 30 April. We will invite shortlisted businesses to a site visit in May.
"""),
(S_NEWS, "Expression of interest: art for bus shelters", "news-eoi news-community", """
We are looking for local artists and community organisations to design artwork for 40 bus shelters on routes 20 and 44. If you would like to take part, send an expression of interest with examples of your work. Selected designs will be printed on the shelter panels for two years.
"""),
(S_NEWS, "Staff training days: later first trams", "news-training tram-general", """
Four times a year we close the tram network for the first two hours of a Sunday morning so that drivers can take part in staff training. Training covers safety procedures, customer service and new equipment on the trains and trams.

On training days the first trams leave Halvering Central at 07:30 instead of 05:30. Early buses run as normal, and an extra early bus runs on route 7 along the Harbour Line. The next training days are listed in the app.
"""),
(S_NEWS, "Family-friendly working and parental leave", "news-careers", """
We want to be a good place to work for parents and carers. All staff can take up to 26 weeks of parental leave on full pay, regardless of gender, and a further 26 weeks at a reduced rate. Staff returning from leave can ask for a phased return and fixed shifts for the first six months.

Staff on parental leave can keep in touch with their team through up to ten paid keeping-in-touch days. We also offer carers' leave, shared leave between partners, and unpaid leave for family emergencies.
"""),
(S_NEWS, "Cathedral organ festival: later buses and trams", "event-organ event-services", """
The Halvering Cathedral organ festival returns from 12 to 20 July, with evening organ recitals every night. To help people get home, the last Campus Line and Harbour Line trams will leave Cathedral Green 30 minutes later than usual, and routes 5 and 14 will run an extra late journey.

If you are going to the closing organ concert on 20 July, we recommend the tram: parking around Cathedral Green is very limited.
"""),
(S_NEWS, "On-demand minibuses in Linnet Vale: a twelve-month experiment", "news-experiment", """
From 1 October we are starting an experiment with on-demand minibuses in Linnet Vale and the surrounding villages. Instead of a fixed timetable, you book a trip in the app or by phone, and a minibus picks you up within 20 minutes at a stop near you.

The experiment replaces routes 77 and 80, which carried very few passengers outside school times. We will publish the results after twelve months and decide then whether to continue. Normal fares apply and all passes are valid.
"""),
(S_NEWS, "Customer experience survey: what you told us", "news-experience", """
More than 6,000 riders took part in our customer experience survey this spring. Overall satisfaction was 84%, up from 79% last year. You rated the trams and the ferry most highly, and told us that the experience of waiting at bus stops is what most needs to improve: more shelters, better lighting and more reliable real-time screens.

Over the next year we will add 120 shelters and replace 300 real-time screens. We will repeat the survey next spring to see whether the experience of travelling with us has improved.
"""),
(S_NEWS, "Next generation ticket machines", "news-machines ticket-machine", """
We are replacing all 180 ticket machines at tram stops with a new generation of machines from next month. The new machines have larger touch screens, audio guidance with a headphone socket, a lower screen that can be reached from a wheelchair, and they can top up every kind of Wayfare card.

Each stop will be without a machine for about half a day while the new one is fitted; you can still buy a ticket in the app or touch in with contactless.
"""),
(S_NEWS, "Working with Halvering University", "news-university pass-university", """
Halvering University and Corrin Sound Transit have renewed their transport partnership for another five years. The partnership funds the university pass, the extra Campus Line trams during term and the night bus N9, which serves the student village.

The university also supports our graduate engineering programme, which takes on twelve graduates each year to work in our operations and engineering teams.
"""),
(S_NEWS, "Our new depot at Pellow", "news-depot", """
Our new bus depot at Pellow opened in March. It has space for 180 buses and chargers for 120 electric buses, a training centre and a bus wash that recycles 90% of its water. The depot replaces the old site on Foundry Street, which will become housing.
"""),
(S_NEWS, "Travel centre opening hours in August", "contact-hours news-careers", """
Because many of our staff take annual leave in August, the Ferrisham Pier kiosk will open from 09:00 to 16:00 on weekdays only during the month. Halvering Central, Harbour Quay and Stonesend travel centres keep their normal opening hours.
"""),
(S_NEWS, "Drive with us: bus driver recruitment", "news-careers news-training", """
We are recruiting bus drivers in Halvering, Stonesend and Ferrisham. You do not need a bus licence: we pay for your training, which takes about eight weeks, and pay you from day one.

Drivers work a four-day week on a rota, with 30 days of annual leave plus public holidays. We welcome applications from people of all backgrounds and ages; our oldest new driver last year was 67.
"""),
(S_NEWS, "Free group travel for community organisations", "news-community fare-group", """
Community organisations in the Corrin Sound area can apply for up to four free group journeys a year for outings, such as lunch clubs, youth groups and carers' groups. Each journey covers up to 20 people on our buses, trams or the ferry.

Organisations apply online with a short description of the trip. We received applications from 140 organizations last year and approved almost all of them.
"""),
(S_NEWS, "Organising a school trip by bus or tram", "fare-group pass-school", """
Schools can travel with us at a special group rate of 60p per pupil, with teachers free, on weekdays between 09:30 and 14:30. Book at least a week ahead with our group travel team, so that we can make sure there is room. If you organize a trip at short notice, we will still try to help.
"""),
(S_NEWS, "Moving to an electric bus fleet", "news-electric", """
By 2030 every bus in our fleet will be electric. This year 64 new electric buses join the fleet, and 40% of our bus miles will be zero-emission. The transition also includes new chargers at all four depots and training for every driver and engineer.

The transition has not always been smooth. The first electric buses had heating problems in the cold winter of 2024, which the manufacturer has since fixed.
"""),
(S_NEWS, "New tram stop for the Little Universe science centre", "news-stop stop-little-universe", """
A new Campus Line stop, Little Universe, opened on 14 April next to the science centre and planetarium. The stop is step-free and has a covered walkway to the entrance. Trams stop every 6 minutes on weekdays and every 10 minutes at weekends. Ask for the combined ticket: tram travel plus entry to the Little Universe for the price of a day ticket.
"""),
(S_NEWS, "Opera House tram stop reopens", "news-stop stop-opera-house", """
Opera House tram stop has reopened after a six-week refurbishment with a new canopy, new lifts and a wider platform. Harbour Line and Campus Line trams call at the stop again. On performance nights, an extra tram leaves Opera House for Halvering Central 15 minutes after the final curtain.
"""),
(S_NEWS, "Inside our operations centre", "news-ops news-about", """
Our operations centre at Pellow is where controllers keep buses, trams and the ferry running. On a typical weekday they deal with more than 400 incidents, from a broken-down bus to a car parked on the tram tracks.

The centre has been in operation since 2019, operating around the clock. The operations team can see the position of every vehicle, talk to every driver, change the timing of traffic lights for late trams, and send messages to the screens at stops. Once a year we open the operations centre to the public; places are free but must be booked.
"""),
(S_NEWS, "How we ran services during Storm Elda", "news-storm delay ferry-weather", """
Storm Elda brought winds of over 80 mph to the Corrin Sound on 17 January. The ferry was suspended for two days, and trees fell on the tracks of the Valley Line near Linnet Vale.

Buses ran throughout, although many ran late and three routes were diverted around fallen trees. Rail replacement buses took over the Valley Line within an hour, and engineers went out overnight to clear the line. Trams were back to normal by the morning of 19 January.

Thank you to everyone who took extra time to travel and to all our staff who worked through the storm.
"""),
(S_NEWS, "Annual report: a year on the network", "news-annual-report news-about", """
In the last financial year we carried 62.4 million journeys: 38.1 million by bus, 21.9 million by tram and 2.4 million on the Sound Ferry. Punctuality was 90% on buses and 96% on trams.

Highlights included the opening of the light rail extension to Linnet Vale, the first full year of the Wayfare card on the ferry, and the first phase of our universal design programme at 80 bus stops. We also held fares below inflation for the second year running.

The year was not without problems. Driver shortages in the autumn led to cancelled journeys on several routes, and the transition to the new fare zones caused confusion for some riders. We have recruited 180 new drivers and rewritten the fare information on this site as a result.
"""),
(S_NEWS, "Route consultation: changes to routes 40 to 45", "news-consultation service-change", """
We are consulting on changes to routes 40, 41, 42, 44 and 45 in the east of the city. The proposals would make route 41 run every 10 minutes, merge routes 42 and 45, and move route 44 away from Copper Lane. Tell us what you think in the online survey by 15 June; you can also pick up a paper copy at Halvering Central.
"""),

# ---------------------------------------------------------------- contact
(S_CONTACT, "General enquiries and contact details", "general-enquiries", """
For general enquiries, call 0300 555 0140 from 07:00 to 20:00 Monday to Friday and 09:00 to 17:00 at weekends, or use the contact form on this site. We aim to answer emails within three working days.

For specific topics it is often quicker to go straight to the right team: lost property, refunds and compensation, passes and concessions, or accessibility and travel assistance. Each has its own form on this site.

Our postal address is Customer Services, Corrin Sound Transit, Pellow Operations Centre, Pellow Road, Halvering.
"""),
(S_CONTACT, "Making a complaint", "feedback-complaint", """
If something went wrong, we want to hear about it. Tell us what happened, when and where, and what you would like us to do. Include the route, the stop and the time, and the vehicle number if you have it.

We reply to complaints within ten working days. If you are not happy with our reply, you can ask for it to be reviewed by a senior manager, and after that you can take it to the independent transport complaints body.
"""),
(S_CONTACT, "Praise and feedback", "feedback-complaint", """
If a driver, customer host or crew member did something great, please let us know. We pass every compliment to the person and their manager, and the best are shared at our staff awards each year.
"""),
(S_CONTACT, "Press and media enquiries", "press", """
Journalists can contact our press office on 0300 555 0199, at any time for urgent matters. For filming or photography on our vehicles or premises, ask at least two weeks ahead.
"""),
(S_CONTACT, "Travel centre opening hours", "contact-hours", """
Halvering Central Travel Centre is open from 07:00 to 19:00 Monday to Saturday and 09:00 to 17:00 on Sundays. Harbour Quay and Stonesend travel centres are open from 08:00 to 18:00 Monday to Saturday. The Ferrisham Pier kiosk is open from 07:30 to 18:30 every day. All travel centres are closed on Christmas Day.
"""),
(S_CONTACT, "Accessibility and travel assistance contacts", "access-assistance general-enquiries", """
For questions about accessible travel, to book travel assistance, or to apply for an Access pass, call 0300 555 0150 or text 61020. The line is open from 07:00 to 21:00 every day. We can also arrange a call back in British Sign Language.
"""),
(S_CONTACT, "Contacting us by phone", "general-enquiries", """
Our general enquiries line is 0300 555 0140. Calls cost the same as a local call. If you are calling about a journey you are on now, choose option 1 to reach the control room.
"""),
(S_CONTACT, "Lost property enquiries", "lost-property general-enquiries", """
Lost property enquiries are handled online. Please use the lost property form rather than the general enquiries line, as call centre staff cannot search the lost property store. If you need help filling in the form, call 0300 555 0140 and choose option 4.
"""),

# ---------------------------------------------------------------- short answers
(S_FARES, "Do children travel free?", "fare-child", "Children under 5 travel free with a paying adult. Children aged 5 to 15 pay the child fare."),
(S_ACCESS, "Can I take my dog on the bus?", "access-dog", "Yes. Dogs on a lead or in a carrier travel free on buses, trams and the ferry, but the driver can refuse a dog that is not under control. Assistance dogs are always welcome."),
(S_TRAMS, "Can I eat on the tram?", "conduct tram-general", "Cold snacks and drinks in a closed container are fine. Hot food is not allowed on trams."),
(S_TIMES, "Is there Wi-Fi on buses?", "onboard-wifi", "Free Wi-Fi is available on all express buses, on trams and on the Sound Ferry. Connect to the network called CST Free and accept the terms."),
(S_TIMES, "Can I charge my phone on board?", "onboard-wifi", "Express buses, the newer city buses and the ferry have USB charging points at most seats. Trams do not have charging points."),
(S_FERRY, "Can I take a surfboard on the ferry?", "luggage-large ferry-general", "Yes, surfboards, paddleboards and kayaks can be carried on the lower deck, free of charge, if you can carry them on and off yourself."),
(S_FERRY, "Is there a toilet on the ferry?", "ferry-general access-toilets", "Yes, the ferry has toilets on the main deck, including an accessible toilet and a baby changing room."),
(S_FARES, "What happens if I forget to touch out?", "fare-contactless", "If you forget to touch out on the tram or ferry, you are charged the maximum fare. You can ask for the difference back in the app within 14 days."),
(S_FARES, "Can I get a receipt?", "fare-buy-onboard", "Drivers can print a receipt for any ticket. For contactless and Wayfare journeys, download a statement from your online account."),
(S_TIMES, "What is a timing point?", "timetable-general", "A timing point is a stop where buses wait if they are early, so that they keep to the timetable. Timing points are shown in bold in printed timetables."),
(S_BIKES, "Can I take my bike on the bus at peak times?", "bike-onboard", "Bikes can be carried on bus racks at any time, but there are only two spaces per bus. On trams, full-size bikes are not allowed during the weekday peaks."),
(S_BIKES, "Can I take an e-scooter on the tram?", "safety-escooter ebike", "No. E-scooters are not allowed on any of our vehicles or in stations, even if folded."),
(S_EXPRESS, "Do express buses stop at every stop?", "express-route", "No. Express buses only stop at the stops shown in the timetable, which are marked with an X on the stop flag."),
(S_EXPRESS, "Are express buses more expensive?", "express-route fare-basics", "No. Express routes cost the same as any other bus, and all tickets and passes are valid."),
(S_NIGHT, "Is there a night tram?", "night-tram", "Trams run until about 01:45 on Friday and Saturday nights. After that, and on other nights, night buses follow the tram routes."),
(S_PASSES, "At what age do I need a ticket?", "fare-child", "Children under 5 travel free. From their fifth birthday they need a child ticket, and from 16 an adult ticket unless they hold a student pass."),
(S_PASSES, "Can I use my senior pass in another region?", "pass-senior", "Senior passes issued by other regions are valid on our buses at off-peak times, but not on the tram or the ferry. Bus operators in other regions accept our senior pass on the same terms."),
(S_PASSES, "Can part-time students get a university pass?", "pass-university", "Yes. Part-time students and staff of Halvering University can buy a university pass for one term at a time."),
(S_PASSES, "Is the university pass valid on night buses?", "pass-university night-bus", "Yes, the university pass is valid on all our services, including night buses and the Sound Ferry."),
(S_PASSES, "Can I get a student pass if I am 22?", "pass-student", "No. The student pass is for ages 16 to 21. If you study at Halvering University, you can buy a university pass at any age."),
(S_CARD, "How do I top up online?", "card-topup", "Sign in to your account, choose your card and select Top up. Online top-ups reach the card the next time you touch it on a reader."),
(S_CARD, "Can I register more than one card?", "card-register", "Yes, you can register up to six cards in one account, for example for your family."),
(S_CARD, "Why did my auto top-up fail?", "card-autoload", "Auto top-up fails if the bank card on your account has expired or been replaced. Update the payment card in your account and the next top-up will go through."),
(S_LOST, "Can someone else collect my lost property?", "lost-property", "Yes, if they bring your reference number, a note signed by you and their own photo ID."),
(S_LOST, "I lost my phone on the bus", "lost-property", "Report it with the lost property form as soon as possible, including the phone's make, colour and case. Phones are usually handed in the same day and held for 60 days."),
(S_LOST, "How do I find my lost umbrella?", "lost-property", "Use the lost property form. We receive about 300 umbrellas a month, so the more detail you give about yours, the easier it is to find."),
(S_REFUNDS, "Can I get a refund if I was late for the ferry?", "refund-unused ferry-fares", "Ferry tickets can be used on any sailing on the same day, so you do not need a refund. Just catch the next ferry."),
(S_REFUNDS, "Is a refund the same as compensation?", "refund-process compensation-delay", "No. A refund returns money for a ticket you did not use. Compensation is a payment for a delay on a journey you did make."),
(S_PNR, "Is park and ride open on Sundays?", "park-and-ride", "Yes. All three park and ride sites are open on Sundays from 08:30 to 19:00, with buses every 15 minutes."),
(S_PNR, "Can I park overnight at park and ride?", "park-and-ride pnr-terms", "Overnight parking is allowed for up to three nights if you register your car online, for example when taking the ferry for a weekend."),
(S_ACCESS, "Do all buses have ramps?", "access-ramp access-wheelchair", "Yes. Every bus has a ramp at the front or centre door. Ask the driver to lower it."),
(S_ACCESS, "Is the tram step-free?", "access-step-free tram-general", "Boarding the tram is level from the platform. 41 of our 46 tram stops are step-free from the street."),
(S_ACCESS, "Are there lifts at Halvering Central?", "access-lift", "Yes, Halvering Central has four lifts linking the street, the bus concourse and the tram platforms."),
(S_SAFETY, "Can I stand on the top deck?", "conduct", "No, for safety reasons standing is not allowed on the upper deck of double-deck buses."),
(S_SAFETY, "What should I do in an emergency on a tram?", "conduct safety-police", "Press the red alarm button by the doors to speak to the driver. Do not try to leave the tram between stops unless staff tell you to."),
(S_NEWS, "Where can I find operator news?", "news-about", "All our news, service updates and consultations are published in the News section of this site and sent out in our monthly travel news email."),
(S_TIMES, "Why does my bus wait at some stops?", "timetable-general", "If a bus is running early, the driver waits at the next timing point so that the bus does not leave before the time in the timetable."),
(S_FERRY, "How long is the ferry crossing?", "ferry-timetable", "The Sound Ferry crossing between Harbour Quay and Ferrisham Pier takes 14 minutes."),
(S_BIKES, "Are pushchairs allowed on express buses?", "pram-onboard express-route", "Yes, pushchairs can travel on express buses, but you may need to fold them at busy times."),
(S_FARES, "Can I pay for someone else with my contactless card?", "fare-contactless", "No. Each person needs their own card or device, because caps are worked out per card. Use a group ticket if you travel together."),
(S_TIMES, "Why did the bus go a different way?", "diversion-general", "Buses sometimes take a diversion because of a road closure or an incident. Diversions are shown on the route page and in the app."),
]
