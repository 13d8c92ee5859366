//! Networks as JSON documents of our own schema: a round trip gives an equal network and
//! the same solution bit for bit; bad documents give errors naming the node or link.

use hydrograde::network::{NETWORK_JSON_VERSION, Network, NetworkOptions};
use hydrograde::{Element, Fitting, Fluid, Line, Pipe, Section};

fn sample() -> Network {
    let pipe =
        |d: f64, l: f64| Element::Pipe(Pipe::new(Section::circle(d).unwrap(), l, 4.5e-5).unwrap());
    let mut net = Network::new();
    net.fixed_head("tank", 40.0, None).unwrap();
    net.fixed_head("main", 35.0, Some(2.0)).unwrap();
    net.node("a", 5.0, 0.004).unwrap();
    net.node("b", 8.0, -0.001).unwrap();
    net.link(
        "t-a",
        "tank",
        "a",
        Line::new(vec![pipe(0.1, 300.0)]).unwrap(),
    )
    .unwrap();
    net.link(
        "a-b",
        "a",
        "b",
        Line::new(vec![
            pipe(0.08, 150.0),
            Element::Fitting(Fitting::named("elbow_90_standard").unwrap()),
            Element::rise(3.0).unwrap(),
        ])
        .unwrap(),
    )
    .unwrap();
    net.link(
        "m-b",
        "main",
        "b",
        Line::new(vec![pipe(0.1, 80.0)]).unwrap(),
    )
    .unwrap();
    net.set_options(NetworkOptions {
        max_iterations: 60,
        ..NetworkOptions::default()
    })
    .unwrap();
    net
}

#[test]
fn round_trip_gives_the_same_network_and_solution() {
    let net = sample();
    let text = net.to_json().unwrap();
    assert!(text.contains(&format!("\"hydrograde_network\": {NETWORK_JSON_VERSION}")));
    let back = Network::from_json(&text).unwrap();
    // Exact: the document keeps every bit of every number.
    assert_eq!(back, net);
    let w = Fluid::water(288.15, 101_325.0).unwrap();
    assert_eq!(back.solve(&w).unwrap(), net.solve(&w).unwrap());
    assert_eq!(back.to_json().unwrap(), text);
}

fn err(text: &str) -> String {
    Network::from_json(text).unwrap_err().to_string()
}

#[test]
fn bad_documents_name_the_node_or_link() {
    let text = sample().to_json().unwrap();
    // Other or missing version.
    let e = err(&text.replace("\"hydrograde_network\": 1", "\"hydrograde_network\": 2"));
    assert!(
        e.contains("version 2") && e.contains("reads version 1"),
        "{e}"
    );
    let e = err("{\"nodes\": [], \"links\": []}");
    assert!(e.contains("hydrograde_network"), "{e}");
    assert!(err("not json").contains("not a network document"));
    // A link to an unknown node names the link and the node.
    let e = err(&text.replace("\"downstream\": \"b\"", "\"downstream\": \"nowhere\""));
    assert!(
        e.contains("link 1 (\"a-b\")") && e.contains("nowhere"),
        "{e}"
    );
    // A node outside reason names the node.
    let e = err(&text.replace("\"elevation\": 8.0", "\"elevation\": 80000.0"));
    assert!(
        e.contains("node 3 (\"b\")") && e.contains("elevation"),
        "{e}"
    );
    // A junction with no elevation; a duplicate name; an unknown field.
    let e = err(&text.replace("\"elevation\": 5.0,", ""));
    assert!(
        e.contains("node 2 (\"a\")") && e.contains("elevation"),
        "{e}"
    );
    let e = err(&text.replace("\"name\": \"b\"", "\"name\": \"a\""));
    assert!(e.contains("already in the network"), "{e}");
    let e = err(&text.replace(
        "\"upstream\": \"tank\"",
        "\"upstream\": \"tank\", \"colour\": 1",
    ));
    assert!(e.contains("colour"), "{e}");
    // A pipe whose line breaks the line's own checks (negative length) names the link.
    let e = err(&text.replace("\"length\": 300.0", "\"length\": -300.0"));
    assert!(e.contains("link 0 (\"t-a\")"), "{e}");
    // Options are checked too.
    let e = err(&text.replace("\"max_iterations\": 60", "\"max_iterations\": 0"));
    assert!(e.contains("options") && e.contains("max_iterations"), "{e}");
}
