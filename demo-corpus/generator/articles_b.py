"""Hand-written help-centre articles, part B (fares, card, timetables, works)."""

from articles_a import (S_FARES, S_CARD, S_TIMES, S_WORKS)

ARTICLES_B = [
# ---------------------------------------------------------------- fares
(S_FARES, "Fares guide", "fare-basics fare-zones fare-cap fare-child", """
This guide explains how our fares work on buses, trams and the Sound Ferry.

Zones. The network is divided into four zones. Zone 1 covers central Halvering and the harbour, zone 2 the inner suburbs and the ferry crossing, zone 3 the outer towns such as Morrow Green and Cawley Heath, and zone 4 the rural routes beyond Stonesend. The price of a single journey depends on how many zones you travel through.

Single fares. An adult single costs £2.10 within one zone, £2.80 for two zones and £3.60 for three or four zones. Child singles cost 70p, £1.00 and £1.20. Concession singles are half the adult fare.

Day tickets and caps. If you pay with contactless or a Wayfare card, we cap what you pay in a day and in a week, so you never pay more than the price of a day ticket or a weekly ticket for the zones you used. You do not need to decide in advance.

Season tickets. For regular travel, weekly, monthly and annual season tickets give unlimited travel in your chosen zones.

Express routes and night buses. Express routes cost the same as other buses. Night buses have a flat fare of £3.00, or you can use any valid day ticket or season ticket.

Paying. You can pay with contactless, a Wayfare card, the Corrin Journeys app or, on buses only, with cash. Drivers give change, but please have coins ready at busy times.
"""),
(S_FARES, "Fare zones", "fare-zones", """
There are four fare zones. You can check the zone of any stop in the journey planner or on the zone map at every tram stop. Stops on a zone boundary count as being in both zones, so you pay the cheaper fare. The ferry crossing counts as zone 2.
"""),
(S_FARES, "Daily and weekly fare caps", "fare-cap fare-contactless card-smart", """
When you pay as you go with the same contactless card, phone or Wayfare card, we add up your fares and stop charging once you reach the cap. The daily cap is £5.60 for zones 1 and 2 and £8.40 for all zones. The weekly cap runs from Monday to Sunday and is £24 for zones 1 and 2 and £36 for all zones.

Once you have ridden enough to reach the cap, the rest of the day's journeys are free. Caps only work if you use the same card or device every time. If you switch between your phone and your card, they are treated as two different cards.
"""),
(S_FARES, "Paying with contactless", "fare-contactless fare-cap", """
You can pay for any bus, tram or ferry journey with a contactless bank card, or with a phone or watch set up for payments. On buses, touch the reader by the driver as you board. On trams and the ferry, touch in at the platform reader before you travel and touch out when you finish.

You are charged once at the end of the day for all your journeys, with caps applied. Your bank statement shows one payment to Corrin Sound Transit. You can see each journey by registering your card in the Corrin Journeys app.
"""),
(S_FARES, "Touching in and out on trams", "fare-contactless tram-general", """
On the tram, touch your card or phone on a platform reader before you board, and touch out on a reader at the stop where you leave the tram. If you forget to touch out, we charge the maximum fare for that line, because we cannot tell where you got off.

If you forgot to touch out, you can ask for the difference back in the app within 14 days. We usually refund it automatically if you touch in again within two hours.
"""),
(S_FARES, "Buying a ticket on the bus", "fare-buy-onboard fare-basics", """
You can buy a single, return or day ticket from the driver. Tell the driver where you are going, then pay by contactless, Wayfare card or cash. Drivers carry up to £20 in change.

If you have bought a ticket in the app, show the ticket on your phone or scan the code on the reader by the door. Tickets bought in the app are valid for 90 minutes from activation, so only activate a ticket shortly before you board.
"""),
(S_FARES, "Ticket machines at tram stops", "ticket-machine fare-basics", """
Every tram stop has at least one ticket machine. Machines sell single, return and day tickets and can top up a Wayfare card. They accept contactless, chip and PIN and coins, but not notes.

If a machine is out of order, use another machine at the stop, buy a ticket in the app, or touch in with contactless. Report faulty machines on the screen of the machine next to it, or to general enquiries.
"""),
(S_FARES, "Penalty fares", "fare-penalty", """
If you rode without a valid ticket, or without touching in on the tram or ferry, a revenue protection officer can charge you a penalty fare of £50, reduced to £25 if you pay within 21 days.

A penalty fare is not a criminal fine, but repeated fare evasion can be taken to court. If you think a penalty fare was issued unfairly, you can appeal online within 21 days. Include your ticket, your bank statement or any other evidence.
"""),
(S_FARES, "Appealing a penalty fare", "fare-penalty", """
You can appeal a penalty fare online. Appeals are handled by an independent appeals service, not by the officer who issued the penalty. You will hear back within 15 working days, and you do not have to pay while the appeal is being considered.
"""),
(S_FARES, "Group tickets", "fare-group", """
A group ticket covers up to five people travelling together, of whom at most two are adults, for a day of unlimited travel on buses and trams in all zones. It costs £14 and can be bought from the driver, at ticket machines and in the app. For larger groups, such as school trips, ask our group travel team.
"""),
(S_FARES, "Return tickets", "fare-return", """
A return ticket costs less than two singles and is valid for the return journey on the same day. For the ferry, the return half is valid for a month. If you pay with contactless or a Wayfare card, you do not need to buy a return: the daily cap makes sure you pay the lowest price.
"""),
(S_FARES, "Fare changes from 5 January 2025", "fare-price-change", """
Most fares increased by an average of 3.9% on 5 January 2025. The adult single for one zone rose from £2.00 to £2.10, and the all-zone daily cap from £8.00 to £8.40. Child fares, the night bus flat fare and the price of a Wayfare card did not change.

Season tickets bought before 5 January keep their old price until they expire. We publish fare changes at least four weeks in advance.
"""),
(S_FARES, "Why do fares go up?", "fare-price-change", """
Fares cover about half of what it costs to run our services; the rest comes from public funding. When fuel, energy, wages and maintenance costs rise, we review fares once a year, in January. We try to keep increases below inflation and protect the cheapest fares.
"""),
(S_FARES, "Zone transition: new fare zones from March 2025", "fare-transition fare-zones", """
On 3 March 2025 we moved from the old seven-zone system to four larger zones. Most journeys became cheaper or stayed the same price.

During the transition, some stops that were on the edge of the old zone 3 moved into zone 2. If your usual stop changed zone, the journey planner now shows the new zone. Paper season tickets bought under the old zones stayed valid until they expired; on a Wayfare card they were converted automatically to the nearest new zone.

If you think you paid too much during the transition period, contact us with your card number and we will check your journeys.
"""),
(S_FARES, "Transitional fares for paper season tickets", "fare-transition pass-season", """
Paper season tickets are being replaced by season tickets on the Wayfare card. During the transitional period, which ends on 31 December 2025, paper weekly and monthly tickets can still be bought at travel centres, but annual tickets are only sold on the card.

Transitional fares for paper tickets match the price of the same ticket on the card. From 2026 you will need a Wayfare card, a registered contactless card or the app for any season ticket.
"""),
(S_FARES, "What happens to paper tickets after the transition?", "fare-transition", """
After 31 December 2025, paper season tickets will no longer be sold. Any paper ticket that is still valid on that date can be used until it expires. Paper single and return tickets from bus drivers will continue for riders who pay with cash.
"""),
(S_FARES, "Changing between bus, tram and ferry", "transfer fare-basics", """
If you pay with contactless, a Wayfare card or the app, any change between buses and trams within 60 minutes of first touching in is free, as long as you stay within the zones you paid for. This is called a free transfer, and it is applied automatically.

To change to the ferry, touch in at the ferry gate. If your bus or tram journey started less than 60 minutes before, you pay only the difference. Paper single tickets bought from the driver do not include transfers.

The best places to change are Halvering Central, Harbour Quay and Stonesend Interchange, where buses, trams and the ferry are all within a few minutes' walk. Halvering Central is also the mainline railway station: allow ten minutes to change between trains and trams.
"""),
(S_FARES, "Free transfers: how the 60-minute rule works", "transfer fare-cap", """
The 60 minutes start when you first touch in. You can make as many connections as you like in that time; the journey you are on when the time runs out still counts as part of the transfer. Going back the way you came counts as a new journey.
"""),
(S_FARES, "Connections at Stonesend Interchange", "transfer stop-stonesend", """
Stonesend Interchange links the Valley Line trams with routes 30, 31, 33, X20 and the P3 park and ride bus. Bus stands A to F are on the upper level, and the tram platforms are below, reached by two lifts and a wide staircase. Allow five minutes for the connection. The departure screens on each level show the next connection from every stand.
"""),
(S_FARES, "Ferry fares", "ferry-fares fare-basics", """
An adult single on the Sound Ferry costs £3.20 and a return £5.60. Children pay £1.40 single. Bikes travel free. The ferry is in zone 2, so season tickets and caps that include zone 2 cover it. Day visitors can buy a Sound Rover ticket for £9, which includes unlimited ferry crossings and zone 1 and 2 buses and trams.
"""),
(S_FARES, "Tickets in the Corrin Journeys app", "ticket-app app-basics", """
You can buy single, return, day and group tickets in the Corrin Journeys app, and season tickets for up to a month. Tickets are stored in your account and can be moved to a new phone. Activate a ticket just before you travel; it shows a moving colour bar and a code that you scan at the reader.

If your phone battery runs out, you will be charged again. Keep a charged phone, or use a Wayfare card as a backup.
"""),
(S_FARES, "I was charged twice with contactless", "refund-overcharge fare-contactless", """
Sometimes your bank shows a pending amount for each touch. This is not a charge, and it disappears within a few days; only the final end-of-day amount is taken.

If you have actually paid twice for the same journey, register your card in the app to see your journey history, then select the journey and choose "Report a problem". Refunds for double charges go back to the card you paid with within five working days.
"""),
(S_FARES, "Can I pay with cash?", "fare-buy-onboard", """
You can pay with cash on buses. Trams and the ferry are cashless, but ticket machines at every tram stop accept coins.
"""),
(S_FARES, "Do drivers give change?", "fare-buy-onboard", """
Yes, drivers give change up to £20, although we appreciate it if you have the right money ready, especially at busy times.
"""),

# ---------------------------------------------------------------- card and app
(S_CARD, "What is the Wayfare card?", "card-smart", """
The Wayfare card is our smart card. It is a plastic travel card that you can load with pay-as-you-go credit, season tickets and passes, and use on all our buses, trams and the Sound Ferry.

Paying with the card is cheaper than buying a paper ticket from the driver, and daily and weekly caps mean you never pay more than a day or weekly ticket. If you register the card, you can protect your balance if the card is lost and see your journey history online.

A Wayfare card costs £3, which is refunded if you return the card in good condition.
"""),
(S_CARD, "Getting a Wayfare card", "card-smart card-register", """
You can buy a Wayfare smart card at any travel centre, from ticket machines at tram stops, at over 80 local shops with the Wayfare sign, or order one online. Student, senior and Access passes are issued as personal Wayfare cards with your photo.
"""),
(S_CARD, "Topping up your Wayfare card", "card-topup card-smart", """
You can top up your card online, in the Corrin Journeys app, at ticket machines, at travel centres and at shops with the Wayfare sign. Top-ups made online reach the card the next time you touch it on a reader, usually within 30 minutes. Drivers cannot top up cards.

The minimum top-up is £5 and the maximum balance is £100.
"""),
(S_CARD, "Auto top-up", "card-autoload card-topup", """
With auto top-up, we add £10 or £20 to your registered Wayfare card whenever the balance falls below £5. Set it up in your online account with a debit or credit card. You can pause or cancel auto top-up at any time.
"""),
(S_CARD, "Registering your Wayfare card", "card-register card-smart", """
Registering a card links it to your online account. It takes two minutes: sign in, choose "Add a card" and type the 16-digit number on the back. Once registered, your balance is protected if the card is lost, and you can see every journey and every top-up.
"""),
(S_CARD, "Checking your balance", "card-balance card-smart", """
You can check the balance on your Wayfare smart card in the app, online if the card is registered, on any ticket machine, or by asking the driver to show it on the reader screen.
"""),
(S_CARD, "My card was declined at the reader", "card-fault card-smart", """
If the reader beeps twice and shows a red light, your card may have too little credit, the season ticket may not cover the zone you are in, or the card may have been blocked. Hold the card flat on the reader for a full second. If it still does not work, check the card in the app or ask staff at a travel centre to test it. Cards damaged by bending or heat are replaced free within the first two years.
"""),
(S_CARD, "Amend your personal details", "account-details app-account", """
You can amend your name, address, email address and phone number in your online account under Profile. Changes to your name on a photo pass need proof, such as a marriage certificate or a deed poll.

If you cannot amend something yourself, for example your date of birth, contact us and we will amend it for you. Please tell us within a month if you move house, because passes and replacement cards are posted to the address on your account.
"""),
(S_CARD, "How to alter your direct debit date", "direct-debit account-details", """
You can alter the date on which your monthly direct debit is taken, for example to match your pay day. Go to Account > Payments > Direct debit and choose a new date between the 1st and the 28th. The change applies from the next month. You can alter the date twice a year.

To alter the bank account your direct debit comes from, set up a new mandate first and then cancel the old one. There is no charge for either.
"""),
(S_CARD, "Signing in to your online account", "app-account", """
You can access your online account on this site or in the Corrin Journeys app with the same email address and password. If you cannot access your account, use "Forgot password" to get a reset link. Links expire after an hour. After five failed attempts, your account is locked for 30 minutes to keep it secure.
"""),
(S_CARD, "The Corrin Journeys app", "app-basics", """
The Corrin Journeys app brings together journey planning, live departures, tickets and your Wayfare account. It is free on phones and tablets.

With the app you can plan a journey, see live bus and tram positions on a map, buy and store tickets, top up your card, report lost property, get alerts for your regular routes, and choose step-free routes.
"""),
(S_CARD, "App problems and known issues", "app-issues app-basics", """
If the app seems buggy after an update, for example if live times do not load or tickets do not appear, close the app fully and open it again. If the problem continues, sign out and back in; your tickets are stored in your account, not on the phone.

Known issues this month: on some older phones the map may go blank after switching to dark mode. A fix is in testing. Live ferry positions can lag by up to two minutes while the vessel is at the pier.
"""),
(S_CARD, "Transferring your balance to a new card", "card-transfer card-smart", """
If your Wayfare card is worn or damaged, or you are swapping to a personal card, you can transfer the balance and any season tickets to a new card. The transfer is free for registered cards. Do it in your online account under Cards > Transfer balance, or at a travel centre. The transfer takes effect the next time you touch the new card on a reader.
"""),
(S_CARD, "Wayfare card for visitors", "card-visitor card-smart", """
Visiting the Corrin Sound area? A visitor Wayfare card comes with a map and a 3-day or 7-day travel pass already loaded. Pick one up at the Ferrisham Visitor Center, at Halvering Central Travel Centre or at Harbour Quay. The card can be topped up and used again on a later visit.
"""),
(S_CARD, "Using the Wayfare card on the ferry", "card-smart ferry-fares", """
Touch your Wayfare card on the reader at the ferry gate before boarding. If you have a season ticket that includes zone 2, the gate opens without charging you. Otherwise, the single ferry fare is taken from your balance, and the return crossing is capped at the return price.
"""),
(S_CARD, "Is my personal data safe?", "contact-privacy app-account", """
We only use your personal data to run your account, provide your tickets and passes and, if you agree, send you travel updates. Journey history is kept for 13 months and then deleted. Our privacy policy explains your rights and how to ask for a copy of your data.
"""),
(S_CARD, "Can I share my Wayfare card?", "card-smart", """
An unregistered pay-as-you-go Wayfare card can be used by anyone, but only by one person per journey. Personal cards with a photo, such as student, senior and university passes, can only be used by the holder.
"""),

# ---------------------------------------------------------------- timetables
(S_TIMES, "Finding timetables", "timetable-general journey-planner", """
You can find the timetable for any route in several ways. In the Corrin Journeys app, search for the route number or a stop and choose "Timetable". On this site, go to Timetables and pick a bus route, tram line or the Sound Ferry. Printed timetable leaflets are available at travel centres and on board.

Timetables show the scheduled departure times from the main stops. For live times, including delays, use the app or the real-time screens at stops.

Timetables change several times a year. Each route page shows the date the current timetable started and any upcoming changes.
"""),
(S_TIMES, "Live departures and real-time information", "realtime timetable-general", """
Most buses and all trams report their position every 15 seconds. The app, the website and the screens at stops use this to show live departures. A time shown as "5 min" is a live prediction; a time shown as "14:35" is the scheduled time, which means we have no live data for that vehicle yet.

If a vehicle departs early or is cancelled, it disappears from the live departures list. You can also text the stop number on the pole to 84488 to get the next departures by text.
"""),
(S_TIMES, "Holiday timetables", "holiday-timetable timetable-general", """
On public holidays most routes run a Sunday timetable. Between Christmas and New Year we run a special timetable, published in early December. School holiday timetables apply on some routes that carry many pupils, and the journeys marked "school days only" do not run.
"""),
(S_TIMES, "How we plan timetable changes", "service-change timetable-general", """
We review every route at least once a year. We look at how many people use each journey, how long buses take between stops at different times of day, feedback from riders and drivers, and planned changes such as new housing or roadworks.

Larger changes are consulted on for six weeks before they are decided. We publish every change on the route page at least three weeks before it starts, and put notices on board and at the affected stops.
"""),
(S_TIMES, "My bus left early or did not turn up", "complaint-early delay feedback-complaint", """
Buses should never leave a timing point early. If your bus left early, or went past the stop without stopping, please tell us, with the route, the stop and the time. We check the vehicle's location data, and drivers who regularly run early are retrained.

If a bus did not turn up at all, it may have been cancelled because of a breakdown or a staff shortage. Cancelled journeys are shown in the app. If you missed an appointment because a bus did not run, you may be able to claim delay compensation.
"""),
(S_TIMES, "Why was my bus late?", "delay", """
Most delays on our buses are caused by traffic, roadworks and incidents on the road, and on trams by faults, obstructions on the track and medical emergencies. We record the cause of every delay of more than five minutes. Last month 91% of buses ran on time, which we count as no more than one minute early or five minutes late.
"""),
(S_TIMES, "School holiday timetables on school routes", "holiday-timetable", """
Journeys marked S in the timetable run on school days only. During school holidays these journeys do not run, but the rest of the route keeps its normal timetable. Holiday dates differ slightly between schools, so check the route page for the exact days.
"""),
(S_TIMES, "Printed timetables", "timetable-general", """
Printed timetable leaflets for every route are available at travel centres and libraries. We can post up to five leaflets to you free of charge. Large print and audio versions are available on request.
"""),
(S_TIMES, "Journey planner", "journey-planner timetable-general", """
The journey planner finds the quickest way between any two places on our network. Enter a stop, a street address or a place name, choose when you want to leave or arrive, and it will show routes by bus, tram and ferry, including walking time.

You can set options to avoid steps, avoid changes or walk less. The planner uses live data for journeys starting in the next hour and the timetable for later journeys.
"""),
(S_TIMES, "Journey planner tips", "journey-planner", """
Type the first few letters of a stop and pick it from the list rather than typing the whole name. To find the last bus home, set "Arrive by" to a late time and look at the last option. Saved journeys appear on the app's home screen.
"""),
(S_TIMES, "Service changes: spring 2025 summary", "service-change timetable-route", """
This page lists all timetable changes on our network that start between March and May 2025.

Routes 3, 7 and 12 move to a new timetable on 9 March, with more frequent buses on Saturdays. Route 20 is extended to the new housing at Linnet Fields. Route 33 loses its late evening journeys after 22:30, replaced by the N33 night bus, which now runs every night. The Campus Line tram runs every six minutes during university term, up from every eight.

The X7 express gains two extra morning journeys, and the X40 now serves Pellow Bay on Sundays. The Sound Ferry summer timetable starts on 4 May with crossings every 20 minutes at peak times.

Full details for each route are on the route pages.
"""),
(S_TIMES, "What does 'request stop' mean?", "timetable-general", """
At a request stop, the bus only stops if someone is waiting and signals to the driver, or if a passenger on board presses the bell. Raise your hand clearly as the bus approaches. Most stops outside town centres are request stops.
"""),
(S_TIMES, "How early should I be at the stop?", "timetable-general", """
Please be at the stop two or three minutes before the time shown in the timetable. Buses will not leave a timing point early, but they may pass other stops a minute or two before the printed time.
"""),

# ---------------------------------------------------------------- works
(S_WORKS, "Rail replacement buses: what to expect", "rail-replacement tram-works", """
When part of the tram network is closed for works, we run rail replacement buses between the stops that are affected. Replacement buses have "Tram replacement" on the front and stop as close as possible to each tram stop, usually on the nearest main road. Yellow signs at each tram stop show where to catch the bus.

Tickets and passes valid on the tram are also valid on the replacement bus. Replacement buses are low-floor with a ramp, but they are slower than the tram, so allow up to 20 extra minutes. Full-size bikes cannot be carried; folding bikes and prams are welcome.
"""),
(S_WORKS, "Planned tram works in 2025", "tram-works rail-replacement", """
We plan most tram maintenance for evenings, Sundays and school holidays, when fewer people travel. This year's main closures are the Harbour Line between Ropewalk and Saltings for track renewal (two weeks in August), the Valley Line between Stonesend and Linnet Vale for overhead line works (three Sundays in October), and the Campus Line for the new University Campus platform (the Christmas vacation). Rail replacement buses run during all closures.
"""),
(S_WORKS, "How diversions work", "diversion-general", """
When a road is closed, buses follow a diversion agreed with the council. We put notices at the affected stops and on this site, and the app shows the diverted route on the map.

During a diversion, some stops are not served. Temporary stops are marked with a yellow flag or sign. If you are unsure, ask the driver before you board, or check the route page for the list of closed stops.
"""),
(S_WORKS, "Why can't buses use the temporary road layout?", "diversion-general", """
Sometimes a road stays open for cars but not for buses, because temporary lanes are too narrow, the turning space is too tight, or a weight limit is in place over a bridge or a trench. We look for the shortest safe diversion in each case.
"""),
]
