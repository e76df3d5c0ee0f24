"""Hand-written help-centre articles, part E (bookings and everyday
questions)."""

from articles_a import (S_FARES, S_PASSES, S_CARD, S_TIMES, S_ACCESS, S_BIKES,
                        S_LOST, S_FERRY, S_TRAMS, S_SAFETY, S_PNR, S_NEWS,
                        S_EXPRESS, S_CONTACT)

ARTICLES_E = [
(S_FARES, "Amending or cancelling a group travel booking", "booking-amend fare-group", """
You can amend a group travel booking free of charge up to 48 hours before the day of travel. Sign in to the group travel portal, open the booking and choose Amend. You can alter the number of people, the date, the time and the pick-up stop.

Within 48 hours of travel we can still try to alter your booking, but we cannot promise seats on busy services. To cancel, choose Cancel booking; the deposit is refunded if you cancel at least seven days before travel.
"""),
(S_ACCESS, "Changing a travel assistance booking", "booking-amend access-assistance", """
To amend or cancel a travel assistance booking, use the link in your confirmation email, the Corrin Journeys app or the assistance line. Please tell us as early as you can if your plans alter, so that staff can help other riders. Bookings can be amended up to 30 minutes before the meeting time.
"""),
(S_NEWS, "Booking an on-demand minibus in Linnet Vale", "news-experiment booking-amend", """
Book a ride in the Corrin Journeys app or by phone up to seven days ahead, or as little as 20 minutes before you want to travel. The app shows the pick-up point and the time the minibus will arrive.

If you need to alter the pick-up time, open the booking and choose a new slot; you can amend a booking as many times as you like until the minibus is on its way. Please cancel if you no longer need the ride, so that the seat can go to someone else.
"""),
(S_PASSES, "Will I lose my student pass if I leave my course?", "pass-student", """
If you leave your course before the end of the year, your school or college will tell us and your student pass will be cancelled at the end of the month. You will not lose any pay-as-you-go credit on the card: it stays on the card and you can keep using it at adult fares.
"""),
(S_PASSES, "Is my senior pass valid if I move away?", "pass-senior", """
If you leave the Corrin Sound area, your senior pass stays valid on our services until it expires, but you should apply for a new pass from the area you move to. Please tell us your new address so that we can close your record.
"""),
(S_FARES, "What if I lose my paper ticket?", "fare-buy-onboard", """
Paper tickets cannot be replaced, so please keep them safe until the end of your journey. If you lose a ticket bought in the app, sign in on another phone and it will appear there. Season tickets on a registered Wayfare card are protected if you lose the card.
"""),
(S_FARES, "Can I get off and back on with the same ticket?", "transfer fare-basics", """
Day tickets, season tickets and pay as you go with caps let you leave the bus and get back on as often as you like. A single ticket from the driver is only valid for one journey: if you leave the bus, you will need a new ticket, unless you are making a free transfer with contactless or a Wayfare card within 60 minutes.
"""),
(S_BIKES, "Can I leave my bike at a tram stop overnight?", "bike-parking", """
You can leave your bike at the stands at any tram stop, including overnight, but please use a good lock and take lights and bags with you. Bikes left for more than 14 days are tagged and then removed to lost property.
"""),
(S_BIKES, "Can I leave luggage on the ferry while I go up on deck?", "luggage-onboard ferry-general", """
You can leave luggage in the racks on the main deck while you go up to the outside deck or the lounge, but we recommend taking valuables with you. Crew check the luggage racks at the end of every crossing, and anything left behind goes to lost property.
"""),
(S_LOST, "Where can I leave luggage near the ferry?", "left-luggage ferry-general", """
The nearest place to leave luggage is the set of lockers in the Harbour Quay ferry terminal, next to the ticket office. For longer stays, the staffed left luggage office at Halvering Central is one tram stop away.
"""),
(S_LOST, "Is there somewhere to leave luggage at Stonesend?", "left-luggage stop-stonesend", """
There is no left luggage service at Stonesend Interchange. The nearest is at Halvering Central, 14 minutes away on the Valley Line tram.
"""),
(S_ACCESS, "Can I leave luggage in the wheelchair space?", "access-priority-seat luggage-onboard", """
No. Please do not leave luggage in the wheelchair space or the pram area, even when the bus is quiet, because a wheelchair user may board at the next stop. Leave luggage in the rack by the door, or keep it on your lap.
"""),
(S_EXPRESS, "Luggage on express buses", "luggage-onboard express-route", """
Express buses have a luggage rack by the front door and, on the X40, a luggage hold. Leave luggage in the rack rather than in the aisle, and keep small bags on your lap or under your seat. Please take everything with you when you leave the bus.
"""),
(S_PNR, "Leaving your car at park and ride for a long weekend", "pnr-terms park-and-ride", """
If you want to leave your car at a park and ride site for more than one night, for example while you take the ferry to Ferrisham, register it online before you leave. You can leave your car for up to three nights. Unregistered cars left overnight may be removed.
"""),
(S_FERRY, "Can I leave the terminal and come back before my sailing?", "ferry-boarding", """
Yes. Your ticket is checked at the boarding gate, not at the terminal door, so you can leave the waiting room and come back as often as you like before boarding.
"""),
(S_TIMES, "Getting off at the right stop", "timetable-general access-hearing", """
Next stop announcements are shown on screens and read out on all our trams and most buses. If you are not sure where to get off, ask the driver when you board and they will tell you. If you went past your stop, get off at the next one and catch a bus back in the other direction: show your ticket to the driver and you will not pay again.
"""),
(S_TRAMS, "The tram left before I could board", "complaint-early tram-general", """
Trams close their doors 20 seconds after arriving at busy stops, or when the driver has checked that boarding is complete. If the tram left while you were at the door, please do not try to force the doors, as this causes delays for everyone. The next tram is usually only a few minutes away. If you think a tram left early, tell us the stop and the time.
"""),
(S_SAFETY, "What should I do if my child is left on a bus?", "safety-child conduct", """
If you are separated from a child, for example if the doors close before they get off, tell the driver or call general enquiries straight away, choosing option 1. Our control room can contact the driver of the bus or tram at once. The driver will keep the child safe on board until you can be reunited, usually at the next stop.
"""),
(S_SAFETY, "Falls on icy pavements near stops", "safety-fall", """
In icy weather, the council grits the pavements at the busiest stops and we salt tram platforms before the first tram. If you slip or fall at a tram stop, tell a customer host or use the help point. Falls on public pavements are the council's responsibility; we can give you the contact details.
"""),
(S_CARD, "Can I transfer a season ticket to someone else?", "card-transfer pass-season", """
Season tickets on a personal card cannot be transferred to another person. If you no longer need the ticket, you can get a refund for the unused part instead.
"""),
(S_CONTACT, "How quickly will you reply?", "general-enquiries feedback-complaint", """
We answer general enquiries within three working days and complaints within ten working days. Refund and compensation requests are generally decided within five working days.
"""),
(S_ACCESS, "Getting off the bus with a wheelchair", "access-wheelchair access-ramp", """
Press the blue button by the wheelchair space before your stop, so that the driver knows to pull in close to the kerb and lower the ramp. Wait until the ramp is fully down before you leave the bus.
"""),
(S_TRAMS, "Tram stops with toilets", "tram-general access-toilets", """
Toilets are available at Halvering Central, Harbour Quay, Stonesend Interchange and University Campus tram stops. The toilets at University Campus are open during term only.
"""),
(S_PASSES, "Student pass or university pass?", "pass-student pass-university pass-overview", """
The student pass is for anyone aged 16 to 21 at a school or college, and gives half-price fares. The university pass is for students and staff of Halvering University, at any age, and gives unlimited travel for a fixed price. If you are at the university, the university pass is almost always better value.
"""),
(S_NEWS, "Updates to our fares and tickets policy", "fare-basics news-about", """
We have updated our fares and tickets policy to reflect the end of paper season tickets, the new rules on app tickets when your phone battery runs out, and the wider use of contactless. The new policy applies from 1 January 2026. The main changes are summarised on the fares guide page.
"""),
]

ARTICLES_E.append(
(S_FARES, "Visiting Halvering: a quick guide for visitors", "card-visitor fare-basics tram-general ferry-general", """
Welcome to Halvering and the Corrin Sound! This page is for visitors traveling from abroad and gives you the basics in one place.

Getting around. Trams (our light rail system) run through the city center every few minutes, buses go everywhere else, and the Sound Ferry crosses to Ferrisham every half hour. The tram lines are color-coded: blue, green and amber.

Paying. The easiest way to pay is to tap a contactless bank card or phone on the reader. Fares are capped each day, so you never pay more than a day ticket. If you prefer a card, pick up a visitor Wayfare smart card at the Ferrisham Visitor Center or at Halvering Central.

At the bus stop. Stand back from the curb until the bus has stopped, and raise your hand so the driver knows you want to board. Buses only stop at the stops shown on the map.

Bikes and scooters. You can rent a bike at Harbour Quay; check the tire pressure before you leave. E-scooters are not allowed on our vehicles.

Groups. If you want to organize a day out for a group, the group ticket covers up to five people for a whole day of travel.
"""))
