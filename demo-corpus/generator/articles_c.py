"""Hand-written help-centre articles, part C (bikes, refunds, night, express,
park and ride, ferry, trams)."""

from articles_a import (S_BIKES, S_REFUNDS, S_NIGHT, S_EXPRESS, S_PNR,
                        S_FERRY, S_TRAMS)

ARTICLES_C = [
# ---------------------------------------------------------------- bikes, prams, luggage
(S_BIKES, "Bikes on buses", "bike-onboard", """
Most of our buses cannot carry full-size bikes inside, but 38 routes have buses with a rack on the front for two bikes. Routes with bike racks are marked with a bike symbol in the timetable.

To use the rack, tell the driver, fold down the rack, lift your bike into the nearest free slot with the front wheel facing the kerb, and raise the support arm over the front tyre. Take off anything loose, such as bags and pumps. When you get off, tell the driver before you unload.

Folding bikes can be carried inside any bus if they are folded and kept out of the aisle. E-bikes are allowed on racks if they weigh less than 25 kg.
"""),
(S_BIKES, "Bikes on trams", "bike-tram", """
Full-size bikes are allowed on trams outside the peak hours of 07:30 to 09:30 and 16:30 to 18:30 on weekdays, and at any time at weekends. Each tram has two bike spaces in the rear carriage, marked on the door. If the spaces are full, please wait for the next tram.

Leave the tram by the rear door with your bike, and keep hold of it while the tram is moving. Tandems, cargo bikes and bikes with trailers cannot be carried.
"""),
(S_BIKES, "Bikes on the Sound Ferry", "bike-ferry ferry-general", """
Bikes travel free on the Sound Ferry. There is space for 24 bikes on the lower deck. Board with your bike after foot passengers, when the crew waves you on, and secure it in the rack. In summer the bike spaces on the 08:00 and 17:30 sailings fill up quickly, so arrive early.
"""),
(S_BIKES, "Folding bikes", "bike-folding bike-onboard", """
Folded bikes can be taken on all buses, trams and the ferry at any time, free of charge. Fold the bike before you board and keep it with you or in the luggage area.
"""),
(S_BIKES, "E-bikes and e-scooters", "ebike safety-escooter", """
E-bikes that meet the legal standard for electrically assisted bikes are treated as normal bikes on trams, racks and the ferry. Please do not charge them on board. If an e-bike tire is flat, wheel the bike through the station rather than riding it.

Privately owned e-scooters are not allowed on our vehicles, at stops or in stations, whether folded or not, because of the fire risk from their batteries. This policy also covers hire scooters.
"""),
(S_BIKES, "Bike parking at stops and park and ride", "bike-parking park-and-ride", """
There are covered bike stands at 30 tram stops, all three park and ride sites and the ferry terminals. Secure cycle hubs at Halvering Central and Stonesend Interchange are open to Wayfare card holders for £1.50 a day, with lockers, a tyre pump, a repair stand and a water point.

Please lock your bike to the stands, not to railings, lamp posts or the kerb-side barriers. Bikes that are left locked for more than 14 days are tagged and then removed.
"""),
(S_BIKES, "Prams and pushchairs on buses", "pram-onboard", """
Prams and pushchairs are welcome on all our buses. Most buses have a space for two unfolded prams next to the wheelchair space. If the space is full, you may be asked to fold your pushchair before you board.

The wheelchair space has priority. If a wheelchair user needs it, please fold your pram or move it if you can. If your child is asleep or you cannot fold it, the driver can ask you to wait for the next bus; we know this is frustrating and we are adding more space on our new buses.

Please keep the brakes on and stay with your pram while the bus is moving.
"""),
(S_BIKES, "Prams and pushchairs on trams", "pram-tram pram-onboard", """
Prams and pushchairs can travel on trams at any time, unfolded. Board through the middle doors, where there is level access and a multi-use area. Apply the brakes and hold the handle while the tram is moving.

At busy stops, leave the tram by the rear door if that is closer to the lift. If the multi-use area is full, there is extra space for a folded buggy behind the last row of seats.
"""),
(S_BIKES, "Prams and pushchairs on the ferry", "pram-ferry pram-onboard ferry-general", """
The Sound Ferry has a large pram area on the main deck next to the baby changing room. You can keep your pram unfolded during the crossing. Use the lift at Harbour Quay or the gentle gangway at Ferrisham Pier.
"""),
(S_BIKES, "Travelling with a double pushchair", "pram-onboard", """
Double pushchairs fit on all our trams and on buses with a wide door. If the bus has a narrow centre door, board at the front. During busy times, side-by-side double pushchairs may not fit with another pram in the space, and the driver may ask you to fold one.
"""),
(S_BIKES, "Luggage on board", "luggage-onboard", """
You can bring luggage on all our services, as long as you can carry it yourself and it does not block the aisle or the doors. Large suitcases go in the luggage rack at the front of the bus or in the luggage bay on trams.

Leave luggage in the rack only while you are on board, and take it with you when you leave. Please do not put bags on seats when the vehicle is busy.
"""),
(S_BIKES, "Large items, suitcases and sports equipment", "luggage-large luggage-onboard", """
Skis, surfboards, musical instruments and large suitcases can be carried if they fit in the luggage area and can be handled by one person. Items longer than two metres cannot be carried on buses. The ferry has a separate area for surfboards and kayaks paddled by the owner.

If you are heading to the ferry with a lot of luggage, consider storing some of it in the left luggage office at Halvering Central.
"""),
(S_BIKES, "Cycle hubs: pumps, tools and tyre repairs", "bike-parking", """
Our cycle hubs at Halvering Central and Stonesend have a free repair stand, a tyre pump with valves for all common tyres, and a vending machine for inner tubes and puncture kits. On the first Saturday of each month, a volunteer mechanic runs a free check-up session: bring your bike for brakes, gears and tire pressure.
"""),
(S_BIKES, "Can I take a shopping trolley on the bus?", "luggage-onboard", """
Yes. Shopping trolleys and wheeled bags are welcome. Please keep them out of the aisle and by your seat, or in the pram space if it is free.
"""),

# ---------------------------------------------------------------- refunds and compensation
(S_REFUNDS, "Refunds: an overview", "refund-process", """
You can ask for a refund if you bought a ticket that you did not use, if you stop needing a season ticket, if you were charged the wrong amount, or if you want the money back from a Wayfare card that you no longer use.

How you get your money back depends on how you paid. App and online purchases are refunded to the card you paid with. Tickets bought from a driver with cash are refunded at a travel centre. Wayfare card balances are refunded by bank transfer.

Delays and cancellations are covered by our delay compensation scheme, which is separate from refunds. See the delay compensation page.
"""),
(S_REFUNDS, "Refund for an unused ticket", "refund-unused refund-process", """
Unused single, return and day tickets bought in the app can be refunded in full if you ask before they are activated, up to 28 days after purchase. Open the ticket and choose "Request a refund". Paper tickets bought from the driver cannot be refunded once printed, unless the service was cancelled.
"""),
(S_REFUNDS, "Season ticket refunds", "refund-season pass-season refund-process", """
If you no longer need your season ticket, you can get a refund for the unused part. For weekly tickets, we refund whole unused days; for monthly and annual tickets, whole unused weeks. We deduct an admin fee of £10, and the refund is worked out from the date you stopped using the ticket, which is usually the date you ask.

If you could not travel because of illness, we can backdate the refund with a doctor's note.
"""),
(S_REFUNDS, "Refunding your Wayfare card balance", "refund-card-balance card-smart", """
If you no longer need your Wayfare card, you can get back the remaining balance and the £3 card deposit. Post the card to us with the refund form, or hand it in at a travel centre. Balances over £10 are paid by bank transfer within ten working days; smaller amounts can be paid in cash at a travel centre.
"""),
(S_REFUNDS, "Delay compensation: how to claim", "compensation-delay", """
If your tram or ferry is more than 15 minutes late, or your bus is more than 30 minutes late, you can claim compensation. We pay 50% of a single fare for delays of 15 to 29 minutes on the tram and ferry, and the full single fare for longer delays. Season ticket holders can claim a share of the daily cost of their ticket.

Claim within 28 days in the app or online. Tell us the date, the time, the route you rode and the stop where you started. If you paid with contactless or a registered Wayfare card, we can usually find the journey for you.

Compensation is paid as credit to your Wayfare card or to your bank card. We do not pay compensation for delays caused by severe weather, police incidents or events outside our control, but we do refund the fare if your service was cancelled.
"""),
(S_REFUNDS, "Compensation when a ferry sailing is cancelled", "compensation-ferry compensation-delay ferry-weather", """
If a Sound Ferry sailing is cancelled, your ticket is valid on the next sailing and on replacement buses via the Tallow Bridge road route. If the cancellation is our fault, for example a crew shortage or a fault on the vessel, you can also claim compensation of a full single fare. Weather cancellations are not compensated, but unused tickets are refunded.
"""),
(S_REFUNDS, "Late running: when can I claim?", "compensation-delay delay", """
You can claim when the service you took ran late by more than the thresholds in our delay compensation scheme: 15 minutes for trams and the ferry, 30 minutes for buses. If the service was cancelled and the next one ran late, we count the delay from the time of the cancelled departure.
"""),
(S_REFUNDS, "Overcharged? Checking your contactless journeys", "refund-overcharge fare-contactless", """
If you think you were charged too much, register your contactless card in the Corrin Journeys app. You will see each journey and the fare we charged. The most common cause of an overcharge is forgetting to touch out on the tram, which we can correct if you tell us within 14 days.
"""),
(S_REFUNDS, "How long do refunds take?", "refund-process", """
Refunds to a bank card take three to five working days after we approve them, and bank transfers up to ten working days. We aim to approve refund requests within five working days.
"""),
(S_REFUNDS, "Refunds for tickets bought in error", "refund-unused", """
If you bought the wrong ticket in the app, for example an adult ticket instead of a child ticket, ask for a refund before you activate it and buy the right one. If you already activated it by mistake, contact us within 24 hours.
"""),

# ---------------------------------------------------------------- night services
(S_NIGHT, "Night buses", "night-bus", """
Our night buses run seven nights a week after the regular service finishes, roughly from midnight to 05:00. The main night routes are the N1, N4, N7, N9, N14, N22 and N33. All of them leave from Halvering Central, stand N, and most run every 30 minutes on Friday and Saturday nights and every hour on other nights.

The night bus fare is a flat £3.00. Day tickets bought the previous day are valid until 04:30, and season tickets are valid at any time.

Night buses carry on-board CCTV and the drivers can call for help at any time. If you feel unsafe at a stop, the help points at major stops connect straight to our control room.
"""),
(S_NIGHT, "Late trams at weekends", "night-tram night-bus", """
On Friday and Saturday nights, trams run every 15 minutes until 01:30 on all three lines. The last tram from Halvering Central leaves at 01:35 on the Harbour Line, 01:40 on the Campus Line and 01:45 on the Valley Line. After that, night buses N1, N4 and N7 follow the tram routes.
"""),
(S_NIGHT, "Staying safe when travelling at night", "night-safety safety-police night-bus", """
Plan your journey home before you go out and check the time of the last tram or the night bus. Wait at well-lit stops with a help point and a real-time screen. On the bus, sit near the driver if you prefer.

If something makes you uncomfortable, tell the driver or use the help point. You can also text our safety team on 61016, any time; the message goes to the control room, which can send transit safety officers or contact the police. In an emergency, always call 999.
"""),
(S_NIGHT, "Night bus fares and tickets", "night-bus fare-basics", """
Night buses have a flat fare of £3.00 for any journey, paid by contactless, Wayfare card or cash. Senior and Access passes are valid on night buses. Child fares apply on the N routes, but children must travel with an adult after midnight.
"""),
(S_NIGHT, "Night ferry crossings on festival weekends", "night-ferry ferry-timetable event-services", """
During the Harbour Festival and on New Year's Eve, the Sound Ferry runs extra night crossings every 40 minutes until 02:00. Normal fares apply, and bikes are not carried after midnight.
"""),

# ---------------------------------------------------------------- express routes
(S_EXPRESS, "Express routes: faster journeys with fewer stops", "express-route", """
Our express routes, numbered with an X, link the outer towns with Halvering city centre and stop only at the busiest stops. They use the main roads and bus lanes, so journeys can be up to 20 minutes quicker than on the regular routes.

Express buses have high-back seats, USB charging points, Wi-Fi and luggage racks. Several express routes connect with mainline trains at Halvering Central. The fare is the same as on any other bus, and all passes and season tickets are valid.

The express routes are X1 (Halvering Central to Pellow Bay), X3 (Halvering Central to Stonesend), X7 (Halvering Central to Morrow Green), X12 (Ferrisham Pier to Ravensby), X20 (Stonesend to Cawley Heath), X40 (Halvering Central to the airport) and X55 (Linnet Vale to Halvering Central).
"""),
(S_EXPRESS, "Do express buses take prams and bikes?", "express-route pram-onboard bike-onboard", """
Yes, express buses have a space for one pram or wheelchair and a luggage rack, and the X12 and X20 have front bike racks. Because express buses are often busy at peak times, you may need to fold your pushchair.
"""),
(S_EXPRESS, "Express bus to the airport (X40)", "express-route express-airport", """
The X40 airport express departs every 20 minutes from Halvering Central, stand X, next to the railway station, to the airport terminal, with stops at Harbour Quay and Eastgate. The journey takes 35 minutes. The first bus leaves at 04:20 and the last at 23:40. Large suitcases go in the luggage hold, which the driver opens at Halvering Central and the airport.
"""),

# ---------------------------------------------------------------- park and ride
(S_PNR, "Park and ride: how it works", "park-and-ride", """
Park and ride lets you leave your car at one of three sites on the edge of Halvering and take a bus into the city centre. The sites are Brindle Fell (P1), Cawley Heath (P2) and Stonesend (P3).

Parking is free, and you pay only for the bus: a park and ride return costs £3.50 for the driver and up to four passengers. Buses run every 10 minutes from 06:30 to 20:00 Monday to Saturday and every 15 minutes on Sundays.

Operating hours are the same at all three sites. Each site has a staffed waiting room, toilets, CCTV and electric vehicle charging. The car parks close at 21:00; cars still there after closing time can be collected the next morning.
"""),
(S_PNR, "Brindle Fell park and ride (P1)", "park-and-ride pnr-brindle-fell", """
Brindle Fell park and ride is on the northern bypass, signposted from the roundabout at the end of the motorway. From the motorway, take the second exit and turn left at the lights. There are 950 spaces, 40 disabled bays and 24 electric vehicle chargers.

The P1 bus runs to Halvering Central via Cathedral Green, taking 18 minutes. On home match days, extra buses run from Brindle Fell to the stadium.
"""),
(S_PNR, "Cawley Heath park-and-ride (P2)", "park-and-ride pnr-cawley-heath", """
Cawley Heath park-and-ride has 700 spaces and is next to the Cawley Road junction. The P2 bus runs every 10 minutes to the Opera House and Halvering Central. The site also has a secure bike shelter, so you can cycle the last part of the journey instead.
"""),
(S_PNR, "Stonesend park and ride (P3)", "park-and-ride pnr-stonesend", """
Stonesend park and ride shares a site with Stonesend Interchange. As well as the P3 bus, you can take the Valley Line tram or routes 30, 31 and X3 into the city. Park and ride tickets are valid on the tram from Stonesend, so choose whichever leaves first.
"""),
(S_PNR, "Park and ride conditions of use", "pnr-terms park-and-ride", """
Parking is free for people using the bus or tram. Vehicles must be parked in a marked bay. Motorhomes and vehicles over 2.2 metres high cannot use the sites.

We are not responsible if you lose property that is left in a vehicle. Please keep valuables out of sight. Cars left overnight without telling us may be removed after 48 hours. If the date you want to leave your car falls on a public holiday, check the opening hours first.
"""),
(S_PNR, "Electric vehicle charging at park and ride", "pnr-ev park-and-ride", """
All three park and ride sites have electric vehicle chargers. Charging costs 45p per kWh, paid in the charging app or by contactless at the charger. Please move your car once it is fully charged so that others can use the bay.
"""),

# ---------------------------------------------------------------- ferry
(S_FERRY, "Sound Ferry timetable", "ferry-timetable ferry-general", """
The Sound Ferry crosses between Harbour Quay in Halvering and Ferrisham Pier every 30 minutes from 06:00 to 23:00, and every 20 minutes at peak times from May to September. The crossing takes 14 minutes.

The first sailing from Ferrisham Pier departs at 06:15 and the last at 23:15. On Sundays and public holidays the first sailing is at 08:00. During the winter refit in January, one of the two ferries is out of service and crossings run every 40 minutes.
"""),
(S_FERRY, "Ferry services in bad weather", "ferry-weather ferry-timetable", """
The captain decides whether it is safe to sail. In strong winds or poor visibility, crossings may be delayed or cancelled at short notice. We post updates in the app, on this site and on the screens at both terminals. If the ferry is suspended, replacement buses run via Tallow Bridge, taking about 45 minutes.
"""),
(S_FERRY, "Boarding the ferry", "ferry-boarding ferry-general", """
Boarding starts ten minutes before departure and closes two minutes before. Touch in at the gate, then wait in the boarding hall until the crew opens the gangway. Cyclists board after foot passengers.

When you leave the ferry, please wait until the crew has secured the gangway. Take all your belongings with you; anything left on board is handed to lost property.
"""),
(S_FERRY, "Our ferries", "ferry-general", """
Our two ferries, the Marram and the Sea Holly, were built in 2019 and carry up to 320 passengers and 24 bikes each. Both ferries are hybrid vessels that run on battery power in the harbour and recharge at Harbour Quay during the turnaround.
"""),
(S_FERRY, "Dogs on the ferry", "ferry-general access-dog", """
Dogs are welcome on the Sound Ferry, free of charge, and must be kept on a lead. Dogs are not allowed in the upper lounge, except assistance dogs.
"""),
(S_FERRY, "Is there food on the ferry?", "ferry-general", """
The kiosk on the main deck sells hot drinks, snacks and sandwiches on sailings between 07:00 and 19:00. You are welcome to bring your own food.
"""),

# ---------------------------------------------------------------- trams
(S_TRAMS, "Tram lines and colours", "tram-lines tram-general access-visual", """
Halvering's light rail network has three lines. The Harbour Line (blue) runs from Eastgate through Halvering Central to Harbour Quay and Saltings. The Campus Line (green) runs from Halvering Central to University Campus, Little Universe and Morrow Green. The Valley Line (amber) runs from Halvering Central to Stonesend Interchange and Linnet Vale.

Every tram shows its line colour and destination on the front. Trams run every 6 to 10 minutes during the day and every 15 minutes in the evening.
"""),
(S_TRAMS, "Leaving the tram: rear doors at busy stops", "tram-doors tram-general", """
At Halvering Central, Harbour Quay and Opera House, please leave the tram by the rear doors if you can, and board through the front and middle doors. This keeps people moving and cuts the time the tram waits at the platform.

If you are carrying luggage or have a pram, leave the tram by the door closest to you; staff on the platform will help if needed. Do not try to board or leave the tram once the door alarm sounds.
"""),
(S_TRAMS, "Tram stop facilities", "tram-general", """
Every tram stop has a shelter, seating, a ticket machine, a help point and a real-time screen. Larger stops also have toilets, cycle parking and a staffed kiosk. Stops are lit from dusk until the last tram has passed.
"""),
(S_TRAMS, "Light rail extension to Linnet Vale", "news-extension tram-general", """
The light rail extension to Linnet Vale opened in September 2024, adding four new stops and 3.2 km of track to the Valley Line. Trams now run every 10 minutes between Stonesend Interchange and Linnet Vale. The new stops are step-free and follow our universal design standard.
"""),
(S_TRAMS, "Is it a tram or light rail?", "tram-general", """
Both. Our trams run on the streets in the city centre and on their own tracks further out, so the network is often called light rail. On signs and in timetables we call the vehicles trams.
"""),
(S_TRAMS, "Tram frequencies", "tram-general timetable-general", """
Trams run every 6 minutes on weekdays between 07:00 and 19:00 on the Harbour Line and the Campus Line, and every 8 minutes on the Valley Line. In the evenings and on Sundays they run every 10 to 15 minutes. The first trams leave at about 05:30.
"""),
]
