# Film stacks: sourced by examples/demo.sh (uses $mudepth, $out and step).
# The Tarnwick Institute, its coating and its batches are invented for the demonstration.

step "TW-N7 coating, batch 7/3 (invented): 100 nm alumina top coat on 2 µm nitride on steel, symmetric scan" \
    film --layer Al2O3,100nm,3.95 --layer Ti0.5Al0.5N,2um,4.6 --substrate Fe --source Cu --two-theta 30:130:20

step "The same stack at 2θ = 37.4° versus incidence: which layer gives the signal" \
    film --layer Al2O3,100nm,3.95 --layer Ti0.5Al0.5N,2um,4.6 --substrate Fe --source Cu --two-theta 37.4 \
    --incidence 0.1,0.2,0.3,0.4,0.5,1,2,5,10,18.7
# The same on a fine grid: the plot $out/tw_n7_film_shares.svg and its CSV.
"$mudepth" film --layer Al2O3,100nm,3.95 --layer Ti0.5Al0.5N,2um,4.6 --substrate Fe --source Cu --two-theta 37.4 \
    --incidence 0.05:6:0.05 --plot "$out/tw_n7_film_shares.svg" --csv > "$out/tw_n7_film_shares.csv"
