// Safety text shown beside calculators that touch something that can hurt people.

export const CAUTION_PROPELLER =
  'A spinning propeller cuts and entangles: make the motor safe (isolated, key out) before anyone reaches near the propeller, in or out of the water, and follow the race rules on guards and kill switches.';
export const CAUTION_WATER =
  'Testing on water needs a safety boat, buoyancy aids and a second person ashore; follow the event safety plan and the instructions of the race officials.';
export const CAUTION_BATTERY =
  'High-current batteries can deliver enough energy to burn, melt tools and start fires: fuse every positive lead close to the battery, keep an isolator within reach, insulate exposed terminals and follow the race rules and local electrical codes; get a qualified person to check the pack and wiring.';
export const CAUTION_CABLE =
  'Size the fuse to protect the cable, not the load; check the insulation temperature rating and bundle derating, and have high-current wiring reviewed by a qualified person against the race rules and local codes.';
export const CAUTION_COOLING =
  'Coolant loops run hot and under pressure: let them cool before opening, wear eye protection, and keep glycol away from skin, drains and open water (it is toxic). Follow the manufacturer’s limits for the motor and controller.';
export const CAUTION_DEFER =
  'These results are design estimates. The race rules, local codes and qualified people take precedence.';
export const CAUTION_FOIL =
  'Foils have sharp edges and lift a boat out of the water: a boat coming off its foils stops abruptly and can throw the driver forward. Test over deep water clear of swimmers and other boats, with a safety boat, buoyancy aids and helmets as the race rules require, and keep hands clear of foil and propeller when the motor can run.';
