# Demo fragment (sourced by examples/demo.sh): the Tarnwick lab checks the Kβ
# filters of its two tubes (the lab is fictional; the physics is not).
step "Kb filter for the Cu tube: the foil for Kb/Ka = 1 %" filter --anode Cu
step "The Ni foil the lab actually has, 20 µm" filter --anode Cu --thickness 20um
