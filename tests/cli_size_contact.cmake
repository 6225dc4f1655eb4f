# End-to-end cases of the contact side (after cli_size.cmake, whose coilfit_cli_case it uses).
coilfit_cli_case(contact.pump-text 0 ARGS size ${ex}/irrigation-pump.json
  STDOUT_MATCH "Contact side.*coil release +[0-9.]+ ms with the plain diode, [0-9.]+ ms with diode \\+ zener")
coilfit_cli_case(contact.heater-json 0 ARGS size ${ex}/greenhouse-heater.json --format json
  STDOUT_MATCH "\"id\": \"contact.current\",\n *\"verdict\": \"pass\"")
coilfit_cli_case(contact.relay-flag 0 ARGS size ${ex}/greenhouse-valve.json --relay pcb-power-relay-12v-10a --load-kind lamp
  STDOUT_MATCH "WARN +contact.inrush")
coilfit_cli_case(contact.inrush-multiple 1 ARGS size ${ex}/irrigation-pump.json --load-inrush 8x
  STDOUT_MATCH "FAIL +contact.inrush +64 A +60 A")
coilfit_cli_case(contact.snubber 0 ARGS size ${ex}/greenhouse-heater.json --load-kind inductive --load-current 4A --load-power-factor 0.7
  STDOUT_MATCH "RC snubber +1.6 µF in series with")
coilfit_cli_case(contact.bad-load-kind 2 ARGS size ${ex}/irrigation-pump.json --load-kind mains
  STDERR_MATCH "--load-kind: expected resistive, inductive")
coilfit_cli_case(contact.unknown-relay 2 ARGS size ${ex}/irrigation-pump.json --relay no-such-relay
  STDERR_MATCH "no relay or contactor \"no-such-relay\"")
coilfit_cli_case(contact.pick-relays 0 ARGS pick ${ex}/greenhouse-vent.json --load-kind motor --top 3
  STDOUT_MATCH "Relays of the table for this load: [1-9][0-9]* of [0-9]+ relay and driver combinations pass both sides")
coilfit_cli_case(contact.pick-relays-json 0 ARGS pick ${ex}/greenhouse-vent.json --load-kind motor --format json
  STDOUT_MATCH "\"relays\": {")
coilfit_cli_case(contact.parts-relay 0 ARGS parts relay STDOUT_MATCH "Relays and contactors \\(1[0-9]\\)")
coilfit_cli_case(contact.parts-contactor 0 ARGS parts contactor STDOUT_MATCH "contactor-small-24vdc-coil")
