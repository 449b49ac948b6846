package org.precedent.demo;

import static org.precedent.demo.DemoAnswer.Season.ANY;
import static org.precedent.demo.DemoAnswer.Season.WINTER;

import java.util.List;

/**
 * Catalogue answers on matters of health and safety. They are reused like any other answer, but a person must
 * send them: the product must hand such tickets to an agent, never reply on its own.
 */
final class DemoAnswersSafety {

  private DemoAnswersSafety() {
  }

  static List<DemoAnswer> all() {
    return List.of(
        DemoAnswer.of("safety.discoloured-water", 5, ANY,
            "Thank you for telling us straight away. Brown or orange water is usually caused by sediment stirred up in our mains, and we're looking into it in your area. Please don't drink the water or use it for cooking until it runs clear: run your cold kitchen tap at a trickle for 20 minutes, and if it hasn't cleared, stop and call our 24-hour line on 01632 960999. Avoid using the washing machine until then, as the water can stain clothes. If it still hasn't cleared within 2 hours, we'll send a technician and arrange bottled water.",
            List.of("Brown water", "URGENT - discoloured water", "Dirty water from taps", "Water is orange", "brown water!!"),
            "Our water is coming out brown. Is it safe to drink?",
            "The water from every tap is orange and rusty this morning.",
            "I ran a bath and the water was the colour of tea!",
            "Brown water at {house} {street}, started about an hour ago.",
            "Dirty water coming out of the cold tap. I have a baby and need to make up bottles.",
            "Why is my water discoloured? It's gone yellow.",
            "My washing has come out stained from the brown water.",
            "Is there a problem in {town}? Our water is brown and has bits in it.",
            "brown water!! what do I do",
            "Since the fire brigade used the hydrant on our road the water has been dirty."),
        DemoAnswer.of("safety.taste-odour", 4, ANY,
            "Please don't drink the water or use it for cooking until we've checked it. A strong chemical, petrol, solvent or sewage smell or taste needs testing, so a water quality technician will contact you today to arrange a visit and take samples, usually within 4 hours. In the meantime, note whether it affects the hot and cold taps or just one, and whether it changes after running the cold kitchen tap for 2 minutes. We'll deliver bottled water if you need it while we investigate.",
            List.of("Water smells of chemicals", "Strange taste", "URGENT water smells", "Water tastes of petrol", "Is our water safe?"),
            "Our water smells of petrol. Is it safe?",
            "The tap water tastes like chemicals, really strong. We've stopped drinking it.",
            "There's a horrible smell like drains coming from the kitchen tap water.",
            "The water has tasted of diesel since the roadworks.",
            "Water smells like rotten eggs from all the taps.",
            "My kids said the water tastes funny and one of them felt sick. Should we stop drinking it?",
            "Strong solvent smell from the cold tap at {house} {street}.",
            "Water smells and tastes disgusting today, like antiseptic.",
            "chemical taste in tap water - safe??"),
        DemoAnswer.of("safety.sewage-flooding", 4, WINTER,
            "We're very sorry this has happened. Sewage flooding is an emergency for us, so please call our 24-hour line on 01632 960999 if you haven't already, and we'll send a team to clear the blockage and clean up, normally within 4 hours. Keep children and pets away from the affected area, don't touch the sewage without rubber gloves, and wash your hands thoroughly. If sewage has come inside your home, we'll arrange a professional clean-up, and you may be entitled to a refund of your sewerage charges for the year.",
            List.of("SEWAGE FLOODING", "Sewage in garden", "Sewage in house", "Urgent - sewage", "Toilet overflowing sewage"),
            "Sewage is coming up through our downstairs toilet and onto the floor!",
            "The manhole in the garden is overflowing with sewage and it's heading for the house.",
            "There's raw sewage in our back garden and the kids can't play out.",
            "Sewage flooded our kitchen last night after the heavy rain.",
            "Toilet paper and sewage are bubbling out of the drain cover by the back door.",
            "Our cellar has sewage in it. What do we do?",
            "sewage everywhere in garden at {house} {street}, please send someone",
            "Every time it rains heavily sewage comes up in our garden. It happened again on {dayMonth}."),
        DemoAnswer.of("safety.burst-main", 4, WINTER,
            "Thank you for reporting this. I've passed the location to our network team, who will send a technician to assess the burst, normally within 2 hours, and fence it off if the road is unsafe. Please keep well away from the water, don't drive through it and don't try to turn anything off yourself. If water is flooding a property or making the road dangerous, please call our 24-hour line on 01632 960999 so we can respond straight away. Live updates will be at tarnwickvale.example/incidents.",
            List.of("Burst main", "Burst pipe in road", "Water pouring into street", "URGENT burst", "Leak in the road"),
            "There's water gushing out of the road on {street}. It looks like a burst pipe.",
            "Big leak in the road outside number {house}, water is running down the hill.",
            "Water is bubbling up through the tarmac at the junction near {postcode}.",
            "A pipe has burst in the street and the road is flooding.",
            "Massive leak near the school on {street}, it's getting worse.",
            "Water is pouring out of a cover in the pavement.",
            "burst main on {street}!!",
            "The road has sunk a bit where the water is coming up. It looks dangerous."),
        DemoAnswer.of("safety.contamination-after-works", 3, ANY,
            "Thank you for letting us know. Water can occasionally be affected after work on the mains, and we need to check this quickly, so please don't drink the water or use it for cooking or baby feeds until we've tested it. A water quality technician will call you today to arrange sampling, and we'll deliver bottled water in the meantime. Please note what you noticed and when it started, and keep a bottle of the water if you can, as it helps our testing.",
            List.of("Water contaminated after works", "Problem since your works", "Water not right after repair", "Worried about water safety"),
            "Since your engineers worked on the pipe in our road the water has tasted strange and my husband has an upset stomach.",
            "Workmen connected something to the main yesterday and now our water is cloudy and smells.",
            "After the works on {street} the water has black bits in it.",
            "I think something got into the water when the contractors were here. It smells of earth.",
            "Since the new pipe was laid outside on {dayMonth} our water tastes of plastic and oil.",
            "Your contractors left the hydrant open and now there's grit in our water. Is it safe?",
            "I'm worried the water is contaminated after the repair on {street}.",
            "contractors worked on the main, now the water tastes off"));
  }
}
